import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { CheckUp } from '../types';
import { checkUpKeys } from './get-check-up';

export const getCheckUps = (studentId: number | null) =>
  api.get<{ items: CheckUp[]; total: number }>(
    studentId === null ? '/check-ups' : `/check-ups?studentId=${studentId}`,
  );

export const checkUpsQueryOptions = (studentId: number | null) =>
  queryOptions({ queryKey: checkUpKeys.list(studentId), queryFn: () => getCheckUps(studentId) });

/** A student's check-ups, newest first. */
export const useCheckUps = (studentId: number | null) => useQuery(checkUpsQueryOptions(studentId));
