import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Lesson } from '../types';
import { courseKeys } from './get-courses';

export type LessonList = { items: Lesson[]; total: number };

export const getLessons = (courseId: number) => api.get<LessonList>(`/courses/${courseId}/lessons`);

export const lessonsQueryOptions = (courseId: number) =>
  queryOptions({ queryKey: courseKeys.lessons(courseId), queryFn: () => getLessons(courseId) });

export const useLessons = (courseId: number | null) =>
  useQuery({ ...lessonsQueryOptions(courseId ?? 0), enabled: courseId !== null });
