import { useMutation } from '@tanstack/react-query';

import { api } from '../../../lib/api-client';
import { saveFile } from '../../../lib/save-file';

export type PlanFormat = 'pdf' | 'csv';

/** The printable review list (PDF) or its rows for a spreadsheet (CSV). */
export const downloadReviewPlan = ({ planId, format }: { planId: number; format: PlanFormat }) =>
  api.download(`/review-plans/${planId}/export.${format}`, `review-plan-${planId}.${format}`);

export const useDownloadReviewPlan = () =>
  useMutation({
    mutationFn: async (input: { planId: number; format: PlanFormat }) => {
      const file = await downloadReviewPlan(input);
      saveFile(file);
      return file;
    },
  });
