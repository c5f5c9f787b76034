import { useMutation } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';

export type SendResult = { sent: { memberId: number; displayName: string }[] };

/** E-mails the plan's PDF to the chosen members (owners and parents only). */
export const sendReviewPlan = ({
  planId,
  ...body
}: {
  planId: number;
  memberIds: number[];
  message?: string;
}) => api.post<SendResult>(`/review-plans/${planId}/send`, body);

export const useSendReviewPlan = () => useMutation({ mutationFn: sendReviewPlan });
