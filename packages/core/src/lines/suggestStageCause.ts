import type { Cause } from '../domain/causes.js';
import type { SuggestedCause } from '../diagnose/types.js';
import type { InterviewStage } from './stages.js';

/** A cause offered from the interview stage, with its reason; the parent decides. */
export interface StageSuggestion {
  readonly cause: Cause;
  readonly because: string;
  readonly ruleIds: readonly string[];
}

/**
 * The cause the interview stage points to (after Newman 1977; White 2005 for the practice):
 * reading → misread; comprehension and transformation → concept; process → what the working
 * itself suggests (`working`: the problem's diagnosis, or a word problem's first wrong line's),
 * `null` when it suggests nothing; encoding → copying.
 * `suggestStageCause('reading', null)` → `{ cause: 'reading', because: 'The child could not …', ruleIds: [] }`.
 */
export function suggestStageCause(
  stage: InterviewStage,
  working: SuggestedCause | null,
): StageSuggestion | null {
  switch (stage) {
    case 'reading':
      return {
        cause: 'reading',
        because:
          'The child could not read the question aloud as written: the words, not the arithmetic, stopped them.',
        ruleIds: [],
      };
    case 'comprehension':
      return {
        cause: 'concept',
        because:
          'The child read it but could not say what it asks: what the question means is the gap.',
        ruleIds: [],
      };
    case 'transformation':
      return {
        cause: 'concept',
        because: 'The child understood the question but chose operations that do not answer it.',
        ruleIds: [],
      };
    case 'process':
      return working
        ? { ...working, because: `It went wrong while working it. ${working.because}` }
        : null;
    case 'encoding':
      return {
        cause: 'copying',
        because: 'The working was right; the answer went wrong when it was written down.',
        ruleIds: [],
      };
  }
}
