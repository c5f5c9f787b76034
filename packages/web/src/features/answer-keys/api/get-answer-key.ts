import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { AnswerKey } from '../types';
import { answerKeyKeys } from './get-answer-keys';

export const getAnswerKey = (id: number) => api.get<AnswerKey>(`/answer-keys/${id}`);

export const answerKeyQueryOptions = (id: number) =>
  queryOptions({ queryKey: answerKeyKeys.detail(id), queryFn: () => getAnswerKey(id) });

export const useAnswerKey = (id: number | null) =>
  useQuery({ ...answerKeyQueryOptions(id ?? 0), enabled: id !== null });

/** Where the browser downloads the key as CSV (the same format the import reads). */
export const answerKeyCsvHref = (id: number) => `/api/answer-keys/${id}/export.csv`;
