import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { MarkInput, SavedMarks } from '../types';
import { sittingKeys } from './get-sittings';

/** `PUT /sittings/:id/marks`: all marks at once; each wrong item becomes a miss (idempotent). */
export const saveMarks = ({ sittingId, marks }: { sittingId: number; marks: MarkInput[] }) =>
  api.put<SavedMarks>(`/sittings/${sittingId}/marks`, { marks });

export function useSaveMarks() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveMarks,
    onSuccess: (saved) => {
      const { misses: _changes, ...sitting } = saved;
      queryClient.setQueryData(sittingKeys.detail(saved.id), sitting);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: sittingKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: sittingKeys.summary(saved.studentId) }),
        // New misses were made from the wrong items (the notebook's lists).
        queryClient.invalidateQueries({ queryKey: ['misses'] }),
      ]);
    },
  });
}
