import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { KeyFieldsInput, KeyItemInput, KeyUpdateResult } from '../types';
import { answerKeyKeys } from './get-answer-keys';

export type KeyUpdate = { id: number } & Partial<KeyFieldsInput> & {
    items?: KeyItemInput[];
    reason?: string;
  };

export const updateAnswerKey = ({ id, ...changes }: KeyUpdate) =>
  api.patch<KeyUpdateResult>(`/answer-keys/${id}`, changes);

export function useUpdateAnswerKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateAnswerKey,
    onSuccess: (key) => {
      const { newCorrections: _n, remarkedSittings, ...saved } = key;
      queryClient.setQueryData(answerKeyKeys.detail(key.id), saved);
      const invalidations = [queryClient.invalidateQueries({ queryKey: answerKeyKeys.lists() })];
      if (remarkedSittings.length > 0) {
        // A correction re-marked sittings: their scores and misses changed too.
        invalidations.push(
          queryClient.invalidateQueries({ queryKey: ['sittings'] }),
          queryClient.invalidateQueries({ queryKey: ['misses'] }),
        );
      }
      return Promise.all(invalidations);
    },
  });
}
