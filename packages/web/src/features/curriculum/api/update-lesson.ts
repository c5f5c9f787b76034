import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Lesson, LessonInput } from '../types';
import { courseKeys } from './get-courses';

export const updateLesson = ({ id, ...changes }: { id: number } & Partial<LessonInput>) =>
  api.patch<Lesson>(`/lessons/${id}`, changes);

export function useUpdateLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateLesson,
    onSuccess: (lesson) =>
      queryClient.invalidateQueries({ queryKey: courseKeys.lessons(lesson.courseId) }),
  });
}
