import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { memberKeys } from './get-members';

/** Revokes a membership; it takes effect on that person's next request. */
export const removeMember = (id: number) => api.delete(`/members/${id}`);

export function useRemoveMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.lists() }),
  });
}
