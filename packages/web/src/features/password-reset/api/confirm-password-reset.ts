import { useMutation } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';

/** Sets the new password with the token from the e-mailed link (it works once, for an hour). */
export const confirmPasswordReset = (input: { token: string; password: string }) =>
  api.post<{ message: string }>('/auth/password-reset/confirm', input);

export const useConfirmPasswordReset = () => useMutation({ mutationFn: confirmPasswordReset });
