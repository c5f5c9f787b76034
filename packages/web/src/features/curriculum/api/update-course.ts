import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Course, CourseInput } from '../types';
import { courseKeys } from './get-courses';

export const updateCourse = ({ id, ...changes }: { id: number } & Partial<CourseInput>) =>
  api.patch<Course>(`/courses/${id}`, changes);

export function useUpdateCourse() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateCourse,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: courseKeys.lists() }),
  });
}
