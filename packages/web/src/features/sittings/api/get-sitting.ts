import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { Sitting } from '../types';
import { sittingKeys } from './get-sittings';

export const getSitting = (id: number) => api.get<Sitting>(`/sittings/${id}`);

export const sittingQueryOptions = (id: number) =>
  queryOptions({ queryKey: sittingKeys.detail(id), queryFn: () => getSitting(id) });

export const useSitting = (id: number) => useQuery(sittingQueryOptions(id));
