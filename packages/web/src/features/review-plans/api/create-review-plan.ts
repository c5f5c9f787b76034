import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { PlanInput, ReviewPlan } from '../types';
import { planKeys } from './get-review-plans';

/** Builds a plan from the chosen misses; they move to "planned". */
export const createReviewPlan = (input: PlanInput) => api.post<ReviewPlan>('/review-plans', input);

export function useCreateReviewPlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createReviewPlan,
    onSuccess: (plan) => {
      queryClient.setQueryData(planKeys.detail(plan.id), plan);
      // The misses changed status and the patterns' fading now counts this plan.
      void queryClient.invalidateQueries({ queryKey: ['misses'] });
      void queryClient.invalidateQueries({ queryKey: ['patterns'] });
      return queryClient.invalidateQueries({ queryKey: planKeys.lists() });
    },
  });
}
