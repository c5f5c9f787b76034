import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { ReviewPlan } from '../types';
import { planKeys } from './get-review-plans';

export const getReviewPlan = (id: number) => api.get<ReviewPlan>(`/review-plans/${id}`);

export const reviewPlanQueryOptions = (id: number) =>
  queryOptions({ queryKey: planKeys.detail(id), queryFn: () => getReviewPlan(id) });

export const useReviewPlan = (id: number) => useQuery(reviewPlanQueryOptions(id));
