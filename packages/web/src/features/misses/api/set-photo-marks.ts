import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Miss, MissPhoto, PhotoMark } from '../types';
import { missKeys } from './get-misses';

export type SetMarksVariables = { missId: number; photoId: number; marks: readonly PhotoMark[] };

/** Replaces every pin on one photo. */
export const setPhotoMarks = ({ photoId, marks }: SetMarksVariables) =>
  api.put<MissPhoto>(`/photos/${photoId}/marks`, {
    marks: marks.map(({ x, y, label }) => (label ? { x, y, label } : { x, y })),
  });

export function useSetPhotoMarks() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setPhotoMarks,
    onSuccess: (photo, { missId }) => {
      queryClient.setQueryData<Miss>(missKeys.detail(missId), (miss) =>
        miss ? { ...miss, photos: miss.photos.map((p) => (p.id === photo.id ? photo : p)) } : miss,
      );
    },
  });
}
