import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { PatternsFilters, PatternsResult } from '../types';

export const patternKeys = {
  all: ['patterns'] as const,
  details: () => [...patternKeys.all, 'detail'] as const,
  detail: (filters: PatternsFilters) => [...patternKeys.details(), filters] as const,
};

export function getPatterns({ studentId, from, to }: PatternsFilters) {
  const search = new URLSearchParams({ studentId: String(studentId) });
  if (from) search.set('from', from);
  if (to) search.set('to', to);
  return api.get<PatternsResult>(`/patterns?${search.toString()}`);
}

export const patternsQueryOptions = (filters: PatternsFilters) =>
  queryOptions({ queryKey: patternKeys.detail(filters), queryFn: () => getPatterns(filters) });

export const usePatterns = (filters: PatternsFilters | null) =>
  useQuery({
    ...patternsQueryOptions(filters ?? { studentId: 0 }),
    enabled: filters !== null,
  });
