import { useMutation } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';

/** Mails the signed-in account a new confirmation link; only the newest link works. */
export const resendEmailVerification = () =>
  api.post<{ message: string }>('/auth/email-verification');

export const useResendEmailVerification = () =>
  useMutation({ mutationFn: resendEmailVerification });
