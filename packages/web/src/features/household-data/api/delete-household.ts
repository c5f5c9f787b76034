import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api, forgetCsrfToken } from '../../../lib/api-client';
import { authKeys, type Me } from '../../../lib/auth';
import { forgetKept } from '../../../lib/kept-me';

export type DeletionSummary = {
  householdId: number;
  rows: Record<string, number>;
  files: number;
  accountsClosed: number;
  /** The owner's own account closes too when this was their only household. */
  yourAccountClosed: boolean;
};

/** Deletes the household and everything in it; `confirm` is its name, typed again. */
export const deleteHousehold = (confirm: string) =>
  api.delete<DeletionSummary>('/households/current', { confirm });

export function useDeleteHousehold() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteHousehold,
    onSuccess: async (summary) => {
      // Nothing of the deleted household may linger in memory.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== authKeys.all[0] });
      if (summary.yourAccountClosed) {
        forgetCsrfToken();
        forgetKept();
        queryClient.setQueryData<Me | null>(authKeys.me(), null);
        return;
      }
      await queryClient.invalidateQueries({ queryKey: authKeys.all });
    },
  });
}
