import type { QueryClient } from '@tanstack/react-query';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { AuthLayout } from '../../components/layouts/auth-layout';
import { LoadingState } from '../../components/states';
import { useToast } from '../../components/toaster';
import { paths } from '../../config/paths';
import { PrivacyCaution } from '../../features/auth/components/privacy-caution';
import { invitationQueryOptions } from '../../features/invitations/api/get-invitation';
import { InvitationView } from '../../features/invitations/components/invitation-view';
import { meQueryOptions, useMe } from '../../lib/auth';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    if (params.token) void queryClient.prefetchQuery(invitationQueryOptions(params.token));
    await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
    return null;
  };

/** `/invitations/:token`, open to anyone with the link: signed in or not, new or not. */
export default function InvitationRoute() {
  const { token = '' } = useParams();
  const me = useMe();
  const navigate = useNavigate();
  const toast = useToast();
  return (
    <AuthLayout title="You are invited">
      {me.isPending ? (
        <LoadingState label="Opening the invitation…" />
      ) : (
        <InvitationView
          token={token}
          me={me.data ?? null}
          caution={(role) => <PrivacyCaution audience={role === 'tutor' ? 'tutor' : 'parent'} />}
          onJoined={(joined) => {
            toast(`Welcome to ${joined.household?.name ?? 'the household'}.`);
            void navigate(paths.app.students.getHref(), { replace: true });
          }}
        />
      )}
    </AuthLayout>
  );
}
