import type { QueryClient } from '@tanstack/react-query';
import { Link, redirect, useNavigate, useSearchParams } from 'react-router-dom';

import { AuthLayout } from '../../components/layouts/auth-layout';
import { paths, safeRedirect } from '../../config/paths';
import { healthQueryOptions } from '../../features/auth/api/get-health';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { meQueryOptions } from '../../lib/auth';

export const clientLoader = (queryClient: QueryClient) => async () => {
  void queryClient.prefetchQuery(healthQueryOptions());
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me) throw redirect(paths.app.students.getHref());
  return null;
};

export default function SignInRoute() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  return (
    <AuthLayout
      title="Sign in"
      intro={
        <p>
          New here?{' '}
          <Link to={paths.createAccount.getHref()}>Create an account for your household</Link>.
        </p>
      }
    >
      <SignInForm
        onSignedIn={() => void navigate(safeRedirect(params.get('redirectTo')), { replace: true })}
      />
    </AuthLayout>
  );
}
