import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Member, MemberChanges } from '../types';
import { memberKeys } from './get-members';

export const updateMember = ({ id, ...changes }: { id: number } & MemberChanges) =>
  api.patch<Member>(`/members/${id}`, changes);

export function useUpdateMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.lists() }),
  });
}
