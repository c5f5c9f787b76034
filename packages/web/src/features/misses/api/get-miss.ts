import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Miss } from '../types';
import { missKeys } from './get-misses';

export const getMiss = (id: number) => api.get<Miss>(`/misses/${id}`);

export const missQueryOptions = (id: number) =>
  queryOptions({ queryKey: missKeys.detail(id), queryFn: () => getMiss(id) });

export const useMiss = (id: number) => useQuery(missQueryOptions(id));
