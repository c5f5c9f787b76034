import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';

import type { Me } from '../../../lib/auth';
import { useOnline } from '../hooks/use-drafts';
import '../drafts.css';

/** Whether the app works without the server now: the browser says so, or the server was not reached. */
export function useOffline(me: Me): boolean {
  const online = useOnline();
  return !online || me.offline === true;
}

/**
 * Says, on every signed-in page, that there is no connection and what still works; when the
 * connection returns everything on the page is asked for again (who is signed in first).
 */
export function OfflineBanner({ me }: { me: Me }) {
  const offline = useOffline(me);
  const queryClient = useQueryClient();
  useEffect(() => {
    const back = () => void queryClient.invalidateQueries();
    window.addEventListener('online', back);
    return () => window.removeEventListener('online', back);
  }, [queryClient]);
  if (!offline) return null;
  return (
    <div className="wb-offline" role="status">
      <strong>You are offline.</strong>{' '}
      {me.household && me.household.role !== 'tutor'
        ? 'Misses you log now are kept on this phone and sent when the connection returns.'
        : 'Pages show again when the connection returns.'}
    </div>
  );
}
