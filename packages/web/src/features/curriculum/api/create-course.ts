import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Course, CourseInput } from '../types';
import { courseKeys } from './get-courses';

export const createCourse = (input: CourseInput) => api.post<Course>('/courses', input);

export function useCreateCourse() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCourse,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: courseKeys.lists() }),
  });
}
