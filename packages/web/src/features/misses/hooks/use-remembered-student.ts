import { useCallback, useState } from 'react';

const keyFor = (householdId: number) => `workback:last-student:${householdId}`;

function read(householdId: number): string {
  try {
    return window.localStorage.getItem(keyFor(householdId)) ?? '';
  } catch {
    return '';
  }
}

/** The student last logged for, per household on this browser (only the id is kept). */
export function useRememberedStudent(householdId: number): [string, (id: string) => void] {
  const [remembered, setRemembered] = useState(() => read(householdId));
  const remember = useCallback(
    (id: string) => {
      setRemembered(id);
      try {
        window.localStorage.setItem(keyFor(householdId), id);
      } catch {
        // Private browsing may refuse storage; the form still works, it just forgets.
      }
    },
    [householdId],
  );
  return [remembered, remember];
}
