import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Student } from '../types';
import { studentKeys } from './get-students';

export const getStudent = (id: number) => api.get<Student>(`/students/${id}`);

export const studentQueryOptions = (id: number) =>
  queryOptions({ queryKey: studentKeys.detail(id), queryFn: () => getStudent(id) });

export const useStudent = (id: number) => useQuery(studentQueryOptions(id));
