import { useMemo, useSyncExternalStore } from 'react';

import { getDraftsSnapshot, subscribeDrafts, type Draft } from '../drafts-store';

/** The drafts kept on this phone for one household, oldest first; updates as they change. */
export function useDrafts(householdId: number): readonly Draft[] {
  const all = useSyncExternalStore(subscribeDrafts, getDraftsSnapshot, getDraftsSnapshot);
  return useMemo(() => all.filter((d) => d.householdId === householdId), [all, householdId]);
}

/** Whether the browser believes it is online; follows the online and offline events. */
export function useOnline(): boolean {
  return useSyncExternalStore(
    (listener) => {
      window.addEventListener('online', listener);
      window.addEventListener('offline', listener);
      return () => {
        window.removeEventListener('online', listener);
        window.removeEventListener('offline', listener);
      };
    },
    () => navigator.onLine,
    () => true,
  );
}
