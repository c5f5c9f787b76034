import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { courseKeys } from './get-courses';

export const deleteCourse = (id: number) => api.delete(`/courses/${id}`);

export function useDeleteCourse() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteCourse,
    onSuccess: (_result, id) => {
      queryClient.removeQueries({ queryKey: courseKeys.lessons(id) });
      return queryClient.invalidateQueries({ queryKey: courseKeys.lists() });
    },
  });
}
