import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { keepStudents } from '../../../lib/kept-me';
import type { Student } from '../types';

export const studentKeys = {
  all: ['students'] as const,
  lists: () => [...studentKeys.all, 'list'] as const,
  detail: (id: number) => [...studentKeys.all, 'detail', id] as const,
};

export type StudentList = { items: Student[]; total: number };

/** Each answer also keeps the children's ids and names on this phone, for logging offline. */
export const getStudents = () =>
  api.get<StudentList>('/students').then((list) => {
    keepStudents(list.items);
    return list;
  });

export const studentsQueryOptions = () =>
  queryOptions({ queryKey: studentKeys.lists(), queryFn: getStudents });

export const useStudents = () => useQuery(studentsQueryOptions());
