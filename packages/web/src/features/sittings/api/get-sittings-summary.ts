import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { SittingsSummary } from '../types';
import { sittingKeys } from './get-sittings';

export const getSittingsSummary = (studentId: number) =>
  api.get<SittingsSummary>(`/students/${studentId}/sittings/summary`);

export const sittingsSummaryQueryOptions = (studentId: number) =>
  queryOptions({
    queryKey: sittingKeys.summary(studentId),
    queryFn: () => getSittingsSummary(studentId),
  });

export const useSittingsSummary = (studentId: number) =>
  useQuery(sittingsSummaryQueryOptions(studentId));
