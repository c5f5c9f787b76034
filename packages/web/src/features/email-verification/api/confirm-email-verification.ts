import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { authKeys } from '../../../lib/auth';

/** Confirms the address with the token from the e-mailed link (it works once, for 48 hours). */
export const confirmEmailVerification = (token: string) =>
  api.post<{ message: string; email: string }>('/auth/email-verification/confirm', { token });

export function useConfirmEmailVerification() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: confirmEmailVerification,
    // A signed-in session in this browser now reads the address as confirmed.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: authKeys.me() }),
  });
}
