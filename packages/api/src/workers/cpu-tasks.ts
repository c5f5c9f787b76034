import { computePatterns, type Patterns } from '@workback/core';
import { renderReviewPlanPdf } from '../review-plans/review-plan-pdf.js';
import type { ReviewPlanJson } from '../review-plans/review-plans.service.js';

/**
 * The work requests hand to the pool's threads (CpuPool calls these exports by name): pure
 * functions of what they are sent, each several milliseconds of CPU that would otherwise hold
 * the event loop every other request is waiting on.
 */

export type PatternsInput = Parameters<typeof computePatterns>;

/** A plan's PDF; it arrives in the caller's thread as a Uint8Array (structured clone). */
export function planPdf(plan: ReviewPlanJson): Promise<Uint8Array> {
  return renderReviewPlanPdf(plan);
}

/** One student's patterns (`@workback/core`). */
export function patterns([misses, options]: PatternsInput): Patterns {
  return computePatterns(misses, options);
}
