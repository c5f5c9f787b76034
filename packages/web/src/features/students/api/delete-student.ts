import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { studentKeys } from './get-students';

export const deleteStudent = (id: number) => api.delete(`/students/${id}`);

export function useDeleteStudent() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteStudent,
    onSuccess: (_result, id) => {
      queryClient.removeQueries({ queryKey: studentKeys.detail(id) });
      return queryClient.invalidateQueries({ queryKey: studentKeys.lists() });
    },
  });
}
