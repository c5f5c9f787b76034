import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Lesson } from '../types';
import { courseKeys } from './get-courses';

export const deleteLesson = (lesson: Pick<Lesson, 'id' | 'courseId'>) =>
  api.delete(`/lessons/${lesson.id}`);

export function useDeleteLesson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteLesson,
    onSuccess: (_result, lesson) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: courseKeys.lessons(lesson.courseId) }),
        queryClient.invalidateQueries({ queryKey: courseKeys.lists() }),
      ]),
  });
}
