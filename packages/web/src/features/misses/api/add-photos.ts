import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api, type UploadProgress } from '../../../lib/api-client';
import type { Miss } from '../types';
import { missKeys } from './get-misses';

export type AddPhotosVariables = {
  missId: number;
  photos: readonly File[];
  onProgress?: (progress: UploadProgress) => void;
};

/** `POST /misses/:id/photos`: more photos for a saved miss (up to four in all). */
export const addPhotos = ({ missId, photos, onProgress }: AddPhotosVariables) => {
  const form = new FormData();
  for (const photo of photos) form.append('photos', photo, photo.name);
  return api.upload<Miss>(`/misses/${missId}/photos`, form, { onProgress });
};

export function useAddPhotos() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addPhotos,
    onSuccess: (miss) => {
      queryClient.setQueryData(missKeys.detail(miss.id), miss);
      return queryClient.invalidateQueries({ queryKey: missKeys.lists() });
    },
  });
}
