import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Miss, MissChanges } from '../types';
import { missKeys } from './get-misses';

export const updateMiss = ({ id, ...changes }: { id: number } & MissChanges) =>
  api.patch<Miss>(`/misses/${id}`, changes);

export function useUpdateMiss() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMiss,
    onSuccess: (miss) => {
      queryClient.setQueryData(missKeys.detail(miss.id), miss);
      return queryClient.invalidateQueries({ queryKey: missKeys.lists() });
    },
  });
}
