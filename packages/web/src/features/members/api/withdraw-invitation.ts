import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { invitationKeys } from './get-invitations';

/** Withdraws an invitation not yet accepted; its link stops working at once. */
export const withdrawInvitation = (id: number) => api.delete(`/invitations/${id}`);

export function useWithdrawInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: withdrawInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationKeys.lists() }),
  });
}
