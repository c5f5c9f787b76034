import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { CheckUp, CheckUpInput } from '../types';
import { checkUpKeys } from './get-check-up';

export const createCheckUp = (input: CheckUpInput) => api.post<CheckUp>('/check-ups', input);

export function useCreateCheckUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCheckUp,
    onSuccess: (checkUp) => {
      queryClient.setQueryData(checkUpKeys.detail(checkUp.id), checkUp);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: checkUpKeys.lists() }),
        // Its sheet is kept as an answer key.
        queryClient.invalidateQueries({ queryKey: ['answer-keys'] }),
      ]);
    },
  });
}
