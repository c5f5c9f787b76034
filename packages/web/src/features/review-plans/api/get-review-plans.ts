import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { PlanSummary } from '../types';

export const planKeys = {
  all: ['review-plans'] as const,
  lists: () => [...planKeys.all, 'list'] as const,
  list: (studentId: number) => [...planKeys.lists(), { studentId }] as const,
  details: () => [...planKeys.all, 'detail'] as const,
  detail: (id: number) => [...planKeys.details(), id] as const,
};

export type PlanList = { items: PlanSummary[]; total: number; page: number; pageSize: number };

/** One student's plans, the newest review day first. */
export const getReviewPlans = (studentId: number) =>
  api.get<PlanList>(`/review-plans?studentId=${studentId}&pageSize=100`);

export const reviewPlansQueryOptions = (studentId: number) =>
  queryOptions({ queryKey: planKeys.list(studentId), queryFn: () => getReviewPlans(studentId) });

export const useReviewPlans = (studentId: number) => useQuery(reviewPlansQueryOptions(studentId));
