import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Lesson, LessonInput } from '../types';
import { courseKeys } from './get-courses';

export const createLesson = ({ courseId, ...input }: { courseId: number } & LessonInput) =>
  api.post<Lesson>(`/courses/${courseId}/lessons`, input);

export function useCreateLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createLesson,
    onSuccess: (lesson) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: courseKeys.lessons(lesson.courseId) }),
        queryClient.invalidateQueries({ queryKey: courseKeys.lists() }),
      ]),
  });
}
