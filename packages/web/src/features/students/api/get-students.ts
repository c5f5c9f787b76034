import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Student } from '../types';

export const studentKeys = {
  all: ['students'] as const,
  lists: () => [...studentKeys.all, 'list'] as const,
  detail: (id: number) => [...studentKeys.all, 'detail', id] as const,
};

export type StudentList = { items: Student[]; total: number };

export const getStudents = () => api.get<StudentList>('/students');

export const studentsQueryOptions = () =>
  queryOptions({ queryKey: studentKeys.lists(), queryFn: getStudents });

export const useStudents = () => useQuery(studentsQueryOptions());
