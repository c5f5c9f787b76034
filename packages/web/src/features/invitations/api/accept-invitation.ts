import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api, forgetCsrfToken } from '../../../lib/api-client';
import { authKeys, type Me } from '../../../lib/auth';
import type { AcceptInput } from '../types';

/**
 * Joins the invitation's household. A new person is signed in by it (a new session, so a new
 * CSRF token); either way the session lands in the new household.
 */
export async function acceptInvitation({ token, ...input }: AcceptInput & { token: string }) {
  const me = await api.post<Me>(`/invitations/${encodeURIComponent(token)}/accept`, input);
  forgetCsrfToken();
  return me;
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (me) => {
      // Nothing of another household may stay cached once this session shows the new one.
      // (The open invitation page keeps its own preview until it moves on.)
      queryClient.removeQueries({
        predicate: (q) => q.queryKey[0] !== authKeys.all[0] && q.queryKey[1] !== 'preview',
      });
      queryClient.setQueryData(authKeys.me(), me);
    },
  });
}
