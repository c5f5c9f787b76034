import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { CheckUp, CheckUpAnswers } from '../types';
import { checkUpKeys } from './get-check-up';

export const answerCheckUp = ({ id, ...input }: CheckUpAnswers & { id: number }) =>
  api.post<CheckUp>(`/check-ups/${id}/answers`, input);

/** Saves the child's answers: a sitting with its marks, new misses, and the reading. */
export function useAnswerCheckUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: answerCheckUp,
    onSuccess: (checkUp) => {
      queryClient.setQueryData(checkUpKeys.detail(checkUp.id), checkUp);
      // Marks made misses and right items: every list and pattern built on them changed.
      return Promise.all(
        [checkUpKeys.lists(), ['sittings'], ['misses'], ['patterns']].map((queryKey) =>
          queryClient.invalidateQueries({ queryKey }),
        ),
      );
    },
  });
}
