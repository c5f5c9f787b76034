import type { QueryClient } from '@tanstack/react-query';
import { Navigate, Outlet, redirect, useLocation, type LoaderFunctionArgs } from 'react-router-dom';

import { AppShell } from '../../components/layouts/app-shell';
import { paths } from '../../config/paths';
import { VerifyEmailNotice } from '../../features/email-verification/components/verify-email-notice';
import { DraftSender } from '../../features/drafts/components/draft-sender';
import { OfflineBanner } from '../../features/drafts/components/offline-banner';
import { canEditHousehold, meQueryOptions, useMe, useSignedIn } from '../../lib/auth';

/** Runs before every signed-in page: nobody signed in → the sign-in page, then back here. */
export const protectedLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = await queryClient.ensureQueryData(meQueryOptions());
    if (!me) {
      const url = new URL(request.url);
      throw redirect(paths.signIn.getHref(url.pathname + url.search));
    }
    return null;
  };

/**
 * Where `/` leads: Students, or with no connection the notebook, where the misses waiting to
 * send are listed beside the way to log another.
 */
export function HomeRedirect() {
  const me = useSignedIn();
  const to =
    me.offline && canEditHousehold(me)
      ? paths.app.notebook.getHref()
      : paths.app.students.getHref();
  return <Navigate to={to} replace />;
}

export function ProtectedRoute() {
  const me = useMe();
  const location = useLocation();
  // The session can also end while a page is open (a 401 from any request clears it).
  if (me.data === null) {
    return <Navigate to={paths.signIn.getHref(location.pathname + location.search)} replace />;
  }
  if (!me.data) return null;
  return (
    <AppShell>
      <OfflineBanner me={me.data} />
      {me.data.household ? <DraftSender householdId={me.data.household.id} /> : null}
      {me.data.user.emailVerified === false ? (
        <VerifyEmailNotice email={me.data.user.email} />
      ) : null}
      <Outlet />
    </AppShell>
  );
}
