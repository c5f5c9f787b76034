import { placeName } from '../numbers/digits.js';
import type { DivisionStep, LongDivisionTrace } from '../trace/types.js';

/**
 * Divides each digit of the dividend on its own by a one-digit divisor, dropping every
 * partial remainder but the last (the `div.remainders-dropped` method). Null for divisors
 * of more than one digit.
 * `divideDigitByDigit('75', '3')?.result` → `'21 R 2'`.
 */
export function divideDigitByDigit(
  dividend: string,
  divisor: string,
): { result: string; trace: LongDivisionTrace; dropped: number[] } | null {
  if (divisor.length !== 1) return null;
  const d = Number(divisor);
  const steps: DivisionStep[] = [];
  const dropped: number[] = [];
  let quotient = '';
  const last = dividend.length - 1;
  for (let pos = 0; pos <= last; pos += 1) {
    const digit = Number(dividend[pos]);
    const q = Math.floor(digit / d);
    const difference = digit - q * d;
    if (pos < last && difference > 0) dropped.push(pos);
    quotient += String(q);
    steps.push({
      position: pos,
      number: digit,
      quotientDigit: q,
      quotientPlace: placeName(last - pos),
      product: q * d,
      difference,
      broughtDown: pos < last ? Number(dividend[pos + 1]) : null,
    });
  }
  quotient = quotient.replace(/^0+(?=\d)/, '');
  const remainder = String((steps[steps.length - 1] as DivisionStep).difference);
  const result = remainder === '0' ? quotient : `${quotient} R ${remainder}`;
  return {
    result,
    trace: { kind: 'long-division', dividend, divisor, steps, quotient, remainder, result },
    dropped,
  };
}
