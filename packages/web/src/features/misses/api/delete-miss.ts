import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { missKeys } from './get-misses';

export const deleteMiss = (id: number) => api.delete(`/misses/${id}`);

export function useDeleteMiss() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteMiss,
    onSuccess: (_result, id) => {
      queryClient.removeQueries({ queryKey: missKeys.detail(id) });
      return queryClient.invalidateQueries({ queryKey: missKeys.lists() });
    },
  });
}
