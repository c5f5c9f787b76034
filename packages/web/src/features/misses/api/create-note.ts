import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Note } from '../types';
import { noteKeys } from './get-notes';

export const createNote = (input: { missId: number; body: string }) =>
  api.post<Note>('/notes', input);

export function useCreateNote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createNote,
    onSuccess: (note) => queryClient.invalidateQueries({ queryKey: noteKeys.forMiss(note.missId) }),
  });
}
