import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Student, StudentInput } from '../types';
import { studentKeys } from './get-students';

export const updateStudent = ({ id, ...changes }: { id: number } & Partial<StudentInput>) =>
  api.patch<Student>(`/students/${id}`, changes);

export function useUpdateStudent() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateStudent,
    onSuccess: (student) => {
      queryClient.setQueryData(studentKeys.detail(student.id), student);
      return queryClient.invalidateQueries({ queryKey: studentKeys.lists() });
    },
  });
}
