import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Course } from '../types';

export const courseKeys = {
  all: ['courses'] as const,
  lists: () => [...courseKeys.all, 'list'] as const,
  lessons: (courseId: number) => [...courseKeys.all, 'lessons', courseId] as const,
};

export type CourseList = { items: Course[]; total: number };

export const getCourses = () => api.get<CourseList>('/courses');

export const coursesQueryOptions = () =>
  queryOptions({ queryKey: courseKeys.lists(), queryFn: getCourses });

export const useCourses = () => useQuery(coursesQueryOptions());
