import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { SittingPage } from '../types';

export type SittingFilters = {
  studentId?: number;
  answerKeyId?: number;
  from?: string;
  to?: string;
  page?: number;
};

export const sittingKeys = {
  all: ['sittings'] as const,
  lists: () => [...sittingKeys.all, 'list'] as const,
  list: (filters: SittingFilters) => [...sittingKeys.lists(), filters] as const,
  detail: (id: number) => [...sittingKeys.all, 'detail', id] as const,
  summary: (studentId: number) => [...sittingKeys.all, 'summary', studentId] as const,
};

function toSearch(filters: SittingFilters): string {
  const search = new URLSearchParams();
  for (const [name, value] of Object.entries(filters)) {
    if (value !== undefined && value !== '') search.set(name, String(value));
  }
  const text = search.toString();
  return text ? `?${text}` : '';
}

export const getSittings = (filters: SittingFilters) =>
  api.get<SittingPage>(`/sittings${toSearch(filters)}`);

export const sittingsQueryOptions = (filters: SittingFilters = {}) =>
  queryOptions({ queryKey: sittingKeys.list(filters), queryFn: () => getSittings(filters) });

export const useSittings = (filters: SittingFilters = {}, options: { enabled?: boolean } = {}) =>
  useQuery({ ...sittingsQueryOptions(filters), enabled: options.enabled ?? true });
