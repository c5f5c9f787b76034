import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { CheckUp } from '../types';

export const checkUpKeys = {
  all: ['check-ups'] as const,
  lists: () => [...checkUpKeys.all, 'list'] as const,
  list: (studentId: number | null) => [...checkUpKeys.lists(), studentId] as const,
  detail: (id: number) => [...checkUpKeys.all, 'detail', id] as const,
};

export const getCheckUp = (id: number) => api.get<CheckUp>(`/check-ups/${id}`);

export const checkUpQueryOptions = (id: number) =>
  queryOptions({ queryKey: checkUpKeys.detail(id), queryFn: () => getCheckUp(id) });

export const useCheckUp = (id: number) => useQuery(checkUpQueryOptions(id));
