import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { AnswerKey, KeyFieldsInput, KeyItemInput } from '../types';
import { answerKeyKeys } from './get-answer-keys';

export const createAnswerKey = (input: KeyFieldsInput & { items: KeyItemInput[] }) =>
  api.post<AnswerKey>('/answer-keys', input);

export function useCreateAnswerKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAnswerKey,
    onSuccess: (key) => {
      queryClient.setQueryData(answerKeyKeys.detail(key.id), key);
      return queryClient.invalidateQueries({ queryKey: answerKeyKeys.lists() });
    },
  });
}
