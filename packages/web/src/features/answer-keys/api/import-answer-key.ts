import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { AnswerKey, KeyFieldsInput } from '../types';
import { answerKeyKeys } from './get-answer-keys';

export type ImportInput = KeyFieldsInput & { file: File };

/** `POST /answer-keys/import` (multipart): the whole file is refused if one row is bad. */
export function importAnswerKey({ file, title, kind, courseId, lessonNumber }: ImportInput) {
  const form = new FormData();
  form.append('title', title);
  form.append('kind', kind);
  if (courseId !== null) form.append('courseId', String(courseId));
  if (lessonNumber !== null) form.append('lessonNumber', String(lessonNumber));
  form.append('file', file, file.name);
  return api.upload<AnswerKey>('/answer-keys/import', form);
}

export function useImportAnswerKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importAnswerKey,
    onSuccess: (key) => {
      queryClient.setQueryData(answerKeyKeys.detail(key.id), key);
      return queryClient.invalidateQueries({ queryKey: answerKeyKeys.lists() });
    },
  });
}
