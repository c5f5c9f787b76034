import { useSyncExternalStore } from 'react';

/** `useMediaQuery('(max-width: 640px)')` → `true` on a phone; follows the window as it resizes. */
export function useMediaQuery(query: string): boolean {
  return useSyncExternalStore(
    (onChange) => {
      const list = window.matchMedia(query);
      list.addEventListener('change', onChange);
      return () => list.removeEventListener('change', onChange);
    },
    () => window.matchMedia(query).matches,
    () => false,
  );
}
