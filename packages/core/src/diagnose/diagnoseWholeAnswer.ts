import type { Answer } from '../parse/types.js';
import type { WorkingTrace } from '../trace/types.js';
import { firstWrongColumn } from './firstWrongColumn.js';
import type { Candidate, Findings } from './types.js';

/**
 * What every diagnosis of a whole-number result does around its own search: an answer that is
 * not a whole number, or the right one, ends it at once; otherwise `search(written)` lists the
 * rules that reproduce the answer, and the first column that differs is named.
 * `diagnoseWholeAnswer({ expected: '125', expectedTrace }, whole('115'), search, { resultName: 'this sum' })`
 * → `{ correct: false, matches: search('115'), firstWrongStep: { place: 'tens', … }, notes: [] }`.
 */
export function diagnoseWholeAnswer(
  correct: { readonly expected: string; readonly expectedTrace: WorkingTrace },
  answer: Answer,
  search: (written: string) => Candidate[],
  options: { readonly resultName: string },
): Findings {
  const base = { expected: correct.expected, expectedTrace: correct.expectedTrace };
  if (answer.kind !== 'whole') {
    return {
      ...base,
      correct: false,
      matches: [],
      firstWrongStep: null,
      notes: [
        `The answer ${answer.text} is not a whole number; ${options.resultName} is ${base.expected}.`,
      ],
    };
  }
  const written = answer.value;
  if (written === base.expected)
    return { ...base, correct: true, matches: [], firstWrongStep: null, notes: [] };
  return {
    ...base,
    correct: false,
    matches: search(written),
    firstWrongStep: firstWrongColumn(base.expected, written),
    notes: [],
  };
}
