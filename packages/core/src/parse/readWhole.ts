import { stripLeadingZeros } from '../numbers/digits.js';
import { quoteInput } from './quoteInput.js';
import type { ReadError } from './types.js';

/** Longest whole number Workback reads (digits), so columns stay drawable. */
export const MAX_DIGITS = 30;

/**
 * Reads one whole number as typed, with or without thousands commas.
 * `readWhole('27,493')` → `{ ok: true, value: '27493' }`;
 * `readWhole('12,34')` → an error naming "12,34".
 */
export function readWhole(
  text: string,
  at?: number,
): { ok: true; value: string } | { ok: false; error: ReadError } {
  const where = at === undefined ? {} : { at };
  if (/^\d+$/.test(text) || /^\d{1,3}(,\d{3})+$/.test(text)) {
    const digits = stripLeadingZeros(text.replace(/,/g, ''));
    if (digits.length > MAX_DIGITS) {
      return {
        ok: false,
        error: {
          message: `${quoteInput(text)} is longer than ${MAX_DIGITS} digits, more than Workback can lay out in columns.`,
          ...where,
        },
      };
    }
    return { ok: true, value: digits };
  }
  if (/^\d[\d,]*$/.test(text)) {
    return {
      ok: false,
      error: {
        message: `${quoteInput(text)} has a comma in an unexpected place; commas can only separate thousands, as in 27,493.`,
        ...where,
      },
    };
  }
  return { ok: false, error: { message: `${quoteInput(text)} is not a whole number.`, ...where } };
}
