import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { PatternNote } from '../types';
import { patternKeys } from './get-patterns';

export type PatternNoteInput = { studentId: number; patternKey: string; body: string };

/** A note on a pattern (a tutor's "worked three zero problems with blocks; steadier"). */
export const createPatternNote = (input: PatternNoteInput) =>
  api.post<PatternNote>('/patterns/notes', input);

export function useCreatePatternNote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createPatternNote,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: patternKeys.all }),
  });
}
