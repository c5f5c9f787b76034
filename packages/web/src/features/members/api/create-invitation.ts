import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Invitation, InvitationInput } from '../types';
import { invitationKeys } from './get-invitations';

/** E-mails an invitation link (the link itself is only in the e-mail). */
export const createInvitation = (input: InvitationInput) =>
  api.post<Invitation>('/invitations', input);

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationKeys.lists() }),
  });
}
