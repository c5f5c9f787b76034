import { placeName } from '../numbers/digits.js';
import type { FirstWrongStep } from './types.js';

/**
 * Compares a written whole-number answer with the correct one column by column from the
 * ones, and names the first column that differs.
 * `firstWrongColumn('43', '57')` → `{ place: 'ones', expected: '3', written: '7', note: 'In the ones column …' }`.
 */
export function firstWrongColumn(expected: string, written: string): FirstWrongStep | null {
  const width = Math.max(expected.length, written.length);
  for (let k = 0; k < width; k += 1) {
    const e = expected[expected.length - 1 - k] ?? '';
    const w = written[written.length - 1 - k] ?? '';
    if (e === w) continue;
    const place = placeName(k);
    const note =
      w === ''
        ? `The correct working has ${e} in the ${place} column; the answer has no digit there.`
        : e === ''
          ? `The answer has an extra ${w} in the ${place} column, where the correct working has no digit.`
          : `In the ${place} column the correct working gives ${e}; the answer has ${w}.`;
    return { place, expected: e, written: w, note };
  }
  return null;
}
