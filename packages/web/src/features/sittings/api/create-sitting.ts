import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Sitting, SittingInput } from '../types';
import { sittingKeys } from './get-sittings';

export const createSitting = (input: SittingInput) => api.post<Sitting>('/sittings', input);

export function useCreateSitting() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSitting,
    onSuccess: (sitting) => {
      queryClient.setQueryData(sittingKeys.detail(sitting.id), sitting);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: sittingKeys.lists() }),
        // The key's sitting count changed.
        queryClient.invalidateQueries({ queryKey: ['answer-keys'] }),
      ]);
    },
  });
}
