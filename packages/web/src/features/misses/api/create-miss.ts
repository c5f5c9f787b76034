import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api, type UploadProgress } from '../../../lib/api-client';
import type { Miss, MissInput } from '../types';
import { missKeys } from './get-misses';

export type CreateMissVariables = {
  input: MissInput;
  photos: readonly File[];
  onProgress?: (progress: UploadProgress) => void;
  /** Sent as `Idempotency-Key`: the same key again answers the miss it made, never a second one. */
  key?: string;
};

/** The text fields of `POST /misses`, as the multipart body carries them. */
export function missFields(input: MissInput): Record<string, string> {
  const fields: Record<string, string> = {
    studentId: String(input.studentId),
    occurredOn: input.occurredOn,
    problem: input.problem,
    answer: input.answer,
  };
  if (input.steps) fields.steps = JSON.stringify(input.steps);
  fields.explanation = input.explanation;
  fields.cause = input.cause;
  fields.note = input.note;
  if (input.lines && input.lines.length > 0) fields.lines = JSON.stringify(input.lines);
  if (input.stage) fields.stage = input.stage;
  return fields;
}

/** The multipart body of `POST /misses`: the fields as text, the photos as `photos`. */
export function missFormData(input: MissInput, photos: readonly File[]): FormData {
  const form = new FormData();
  for (const [name, value] of Object.entries(missFields(input))) form.set(name, value);
  for (const photo of photos) form.append('photos', photo, photo.name);
  return form;
}

export const createMiss = ({ input, photos, onProgress, key }: CreateMissVariables) =>
  api.upload<Miss>('/misses', missFormData(input, photos), {
    onProgress,
    headers: key ? { 'Idempotency-Key': key } : undefined,
  });

/** A fresh Idempotency-Key: 128 random bits as hex (works on plain http, unlike randomUUID). */
export function newRequestKey(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

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
