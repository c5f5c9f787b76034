import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Student, StudentInput } from '../types';
import { studentKeys } from './get-students';

export const createStudent = (input: StudentInput) => api.post<Student>('/students', input);

export function useCreateStudent() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createStudent,
    onSuccess: (student) => {
      queryClient.setQueryData(studentKeys.detail(student.id), student);
      return queryClient.invalidateQueries({ queryKey: studentKeys.lists() });
    },
  });
}
