import type { QueryClient } from '@tanstack/react-query';
import { Link, redirect, useNavigate } from 'react-router-dom';

import { AuthLayout } from '../../components/layouts/auth-layout';
import { useToast } from '../../components/toaster';
import { paths } from '../../config/paths';
import { CreateAccountForm } from '../../features/auth/components/create-account-form';
import { meQueryOptions } from '../../lib/auth';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me) throw redirect(paths.app.students.getHref());
  return null;
};

export default function CreateAccountRoute() {
  const navigate = useNavigate();
  const toast = useToast();
  return (
    <AuthLayout
      title="Create an account"
      intro={
        <p>
          One account per household. You can invite a second parent or a tutor later. Already have
          one? <Link to={paths.signIn.getHref()}>Sign in</Link>.
        </p>
      }
    >
      <CreateAccountForm
        onCreated={(me) => {
          toast(`Welcome, ${me.user.displayName}. Your household is ready.`);
          void navigate(paths.app.students.getHref(), { replace: true });
        }}
      />
    </AuthLayout>
  );
}
