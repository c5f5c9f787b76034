import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { answerKeyKeys } from './get-answer-keys';

export const deleteAnswerKey = (id: number) => api.delete(`/answer-keys/${id}`);

export function useDeleteAnswerKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteAnswerKey,
    onSuccess: (_result, id) => {
      queryClient.removeQueries({ queryKey: answerKeyKeys.detail(id) });
      return queryClient.invalidateQueries({ queryKey: answerKeyKeys.lists() });
    },
  });
}
