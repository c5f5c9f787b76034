import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api, type UploadProgress } from '../../../lib/api-client';
import type { Miss, MissInput } from '../types';
import { missKeys } from './get-misses';

export type CreateMissVariables = {
  input: MissInput;
  photos: readonly File[];
  onProgress?: (progress: UploadProgress) => void;
};

/** The multipart body of `POST /misses`: the fields as text, the photos as `photos`. */
export function missFormData(input: MissInput, photos: readonly File[]): FormData {
  const form = new FormData();
  form.set('studentId', String(input.studentId));
  form.set('occurredOn', input.occurredOn);
  form.set('problem', input.problem);
  form.set('answer', input.answer);
  if (input.steps) form.set('steps', JSON.stringify(input.steps));
  form.set('explanation', input.explanation);
  form.set('cause', input.cause);
  form.set('note', input.note);
  for (const photo of photos) form.append('photos', photo, photo.name);
  return form;
}

export const createMiss = ({ input, photos, onProgress }: CreateMissVariables) =>
  api.upload<Miss>('/misses', missFormData(input, photos), { onProgress });

export function useCreateMiss() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createMiss,
    onSuccess: (miss) => {
      queryClient.setQueryData(missKeys.detail(miss.id), miss);
      return queryClient.invalidateQueries({ queryKey: missKeys.lists() });
    },
  });
}
