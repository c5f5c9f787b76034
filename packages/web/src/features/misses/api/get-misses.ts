import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { MissFilters, MissPage } from '../types';

export const missKeys = {
  all: ['misses'] as const,
  lists: () => [...missKeys.all, 'list'] as const,
  list: (filters: MissFilters) => [...missKeys.lists(), filters] as const,
  details: () => [...missKeys.all, 'detail'] as const,
  detail: (id: number) => [...missKeys.details(), id] as const,
};

/** `missQueryString({ studentId: 2, page: 1, … })` → `'?studentId=2&page=1&…'`, empty filters left out. */
export function missQueryString(filters: MissFilters): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) {
    if (value === undefined || value === '') continue;
    params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}

export const getMisses = (filters: MissFilters) =>
  api.get<MissPage>(`/misses${missQueryString(filters)}`);

export const missesQueryOptions = (filters: MissFilters) =>
  queryOptions({
    queryKey: missKeys.list(filters),
    queryFn: () => getMisses(filters),
    placeholderData: keepPreviousData,
  });

export const useMisses = (filters: MissFilters) => useQuery(missesQueryOptions(filters));
