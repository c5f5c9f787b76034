import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from './api-client';
import { authKeys, type HouseholdSummary, type Me } from './auth';

export type CurrentHousehold = HouseholdSummary & { createdAt: string };

/** Moves this session to another of the person's households (a tutor working with several). */
export const switchHousehold = (householdId: number) =>
  api.post<CurrentHousehold>('/households/current', { householdId });

/**
 * After a switch nothing cached may belong to the old household: who-am-I is fetched afresh and
 * every other query starts again from empty (a loading state, never the old family's data under
 * the new name). Not awaited, so the caller can move to a page of the new household at once.
 */
export function useSwitchHousehold() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: switchHousehold,
    onSuccess: (current) => {
      queryClient.setQueryData<Me | null>(authKeys.me(), (me) =>
        me ? { ...me, household: { id: current.id, name: current.name, role: current.role } } : me,
      );
      void queryClient.invalidateQueries({ queryKey: authKeys.all });
      void queryClient.resetQueries({ predicate: (q) => q.queryKey[0] !== authKeys.all[0] });
    },
  });
}
