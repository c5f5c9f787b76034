import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';

export type Health = { status: 'ok'; demo: boolean; version: string };

export const getHealth = () => api.get<Health>('/health');

export const healthQueryOptions = () =>
  queryOptions({ queryKey: ['health'], queryFn: getHealth, staleTime: 5 * 60_000 });

export const useHealth = () => useQuery(healthQueryOptions());
