import { useMutation } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';

/** Always the same answer, whether or not the address has an account. */
export const requestPasswordReset = (email: string) =>
  api.post<{ message: string }>('/auth/password-reset', { email });

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
