import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { AnswerKeySummary } from '../types';

export const answerKeyKeys = {
  all: ['answer-keys'] as const,
  lists: () => [...answerKeyKeys.all, 'list'] as const,
  detail: (id: number) => [...answerKeyKeys.all, 'detail', id] as const,
};

export type AnswerKeyList = { items: AnswerKeySummary[]; total: number };

export const getAnswerKeys = () => api.get<AnswerKeyList>('/answer-keys');

export const answerKeysQueryOptions = () =>
  queryOptions({ queryKey: answerKeyKeys.lists(), queryFn: getAnswerKeys });

export const useAnswerKeys = () => useQuery(answerKeysQueryOptions());
