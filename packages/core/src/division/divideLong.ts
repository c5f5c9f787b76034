import { placeName } from '../numbers/digits.js';
import type { DivisionStep, LongDivisionTrace } from '../trace/types.js';

/** A way of doing long division; the defaults are the correct method. */
export interface DivisionMethod {
  /** `write` (correct) or `omit`: no 0 in the quotient when a brought-down number is smaller than the divisor. */
  readonly zeroInQuotient?: 'write' | 'omit';
  /** Change one quotient digit (by its position from the left among written digits) by `by`, the rest of the working unchanged. */
  readonly slip?: { readonly step: number; readonly by: number };
  /** Take the last quotient digit `by` too small, leaving a larger remainder. */
  readonly shortLast?: number;
}

export interface DivisionRun {
  readonly quotient: string;
  readonly remainder: string;
  readonly result: string;
  readonly trace: LongDivisionTrace;
  /** Steps where the method departed from the correct one. */
  readonly fired: readonly number[];
}

/**
 * Long division, left to right: divide, multiply, subtract, bring down. Returns null when
 * the method cannot be applied as asked (a slip or shortfall that does not fit).
 * `divideLong('612', '6')?.result` → `'102'`;
 * `divideLong('612', '6', { zeroInQuotient: 'omit' })?.result` → `'12'`.
 */
export function divideLong(
  dividend: string,
  divisor: string,
  method: DivisionMethod = {},
): DivisionRun | null {
  const d = Number(divisor);
  const omit = method.zeroInQuotient === 'omit';
  const steps: DivisionStep[] = [];
  const fired: number[] = [];
  let current = 0;
  let started = false;
  let quotient = '';
  const last = dividend.length - 1;
  for (let pos = 0; pos <= last; pos += 1) {
    current = current * 10 + Number(dividend[pos]);
    if (!started && current < d && pos < last) continue;
    let q = Math.floor(current / d);
    const stepIndex = steps.length;
    if (method.slip !== undefined && method.slip.step === stepIndex) {
      q += method.slip.by;
      if (q < 0 || q > 9) return null;
      fired.push(stepIndex);
    }
    const rightQ = Math.floor(current / d);
    if (method.shortLast !== undefined && pos === last) {
      q -= method.shortLast;
      if (q < 0) return null;
      fired.push(stepIndex);
    }
    // A fact slip leaves the subtraction as it would have been; a shortfall really subtracts less.
    const usedQ = method.slip !== undefined && method.slip.step === stepIndex ? rightQ : q;
    const productValue = usedQ * d;
    const difference = current - productValue;
    const skip = omit && started && rightQ === 0;
    if (skip) fired.push(stepIndex);
    const written = skip ? null : q;
    if (written !== null && !(quotient === '' && written === 0 && pos < last))
      quotient += String(written);
    started = true;
    steps.push({
      position: pos,
      number: current,
      quotientDigit: written,
      quotientPlace: placeName(last - pos),
      product: productValue,
      difference,
      broughtDown: pos < last ? Number(dividend[pos + 1]) : null,
    });
    current = difference;
  }
  if (quotient === '') quotient = '0';
  quotient = quotient.replace(/^0+(?=\d)/, '');
  const remainder = String(current);
  const result = remainder === '0' ? quotient : `${quotient} R ${remainder}`;
  return {
    quotient,
    remainder,
    result,
    trace: { kind: 'long-division', dividend, divisor, steps, quotient, remainder, result },
    fired,
  };
}
