import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import type { ReviewPlan } from '../types';
import { planKeys } from './get-review-plans';

/** Checks one item off (or back on); a miss whose every item is done becomes resolved. */
export const checkPlanItem = ({
  planId,
  itemId,
  done,
}: {
  planId: number;
  itemId: number;
  done: boolean;
}) => api.patch<ReviewPlan>(`/review-plans/${planId}`, { items: [{ id: itemId, done }] });

export function useCheckPlanItem() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: checkPlanItem,
    onSuccess: (plan) => {
      queryClient.setQueryData(planKeys.detail(plan.id), plan);
      void queryClient.invalidateQueries({ queryKey: ['misses'] });
      return queryClient.invalidateQueries({ queryKey: planKeys.lists() });
    },
  });
}
