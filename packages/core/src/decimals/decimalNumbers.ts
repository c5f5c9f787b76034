import { stripLeadingZeros } from '../numbers/digits.js';
import type { Answer, DecimalNumber } from '../parse/types.js';

/**
 * The number's digits with the point moved `places` to the right, as a whole number:
 * `scaleDecimal({ whole: '4', decimals: '5' }, 2)` → `'450'`.
 */
export function scaleDecimal(n: DecimalNumber, places: number): string {
  return stripLeadingZeros(`${n.whole}${n.decimals.padEnd(places, '0')}`);
}

/**
 * A whole number of hundredths (or other `places`) written as a decimal, trailing zeros
 * after the point dropped unless `keep` places are wanted (money keeps 2):
 * `unscaleDecimal('675', 2)` → `'6.75'`; `unscaleDecimal('300', 2)` → `'3'`; `unscaleDecimal('300', 2, 2)` → `'3.00'`.
 */
export function unscaleDecimal(digits: string, places: number, keep = 0): string {
  const padded = digits.padStart(places + 1, '0');
  const whole = stripLeadingZeros(padded.slice(0, padded.length - places));
  let decimals = padded.slice(padded.length - places);
  while (decimals.length > keep && decimals.endsWith('0')) decimals = decimals.slice(0, -1);
  decimals = decimals.padEnd(keep, '0');
  return decimals === '' ? whole : `${whole}.${decimals}`;
}

/** The answer as a decimal when it is one (or a whole number), else `null`. */
export function decimalOfAnswer(answer: Answer): DecimalNumber | null {
  if (answer.kind === 'whole') return { whole: answer.value, decimals: '' };
  if (answer.kind === 'decimal') return { whole: answer.whole, decimals: answer.decimals };
  return null;
}

/** `sameValue(6.750, 6.75)` → true. */
export function sameValue(a: DecimalNumber, b: DecimalNumber): boolean {
  const places = Math.max(a.decimals.length, b.decimals.length);
  return scaleDecimal(a, places) === scaleDecimal(b, places);
}

/** `readDecimalText('6.75')` → `{ whole: '6', decimals: '75' }`. */
export function readDecimalText(text: string): DecimalNumber {
  const [whole = '0', decimals = ''] = text.split('.');
  return { whole, decimals };
}

/**
 * Column names once the point stands `places` columns from the right: the scaled column `k`
 * is the place `k − places` (`'tenths'`, `'hundredths'` … to its right).
 * `decimalPlaceName(0, 2)` → `'hundredths'`.
 */
export function decimalPlaceName(k: number, places: number, names: (k: number) => string): string {
  const real = k - places;
  if (real >= 0) return names(real);
  return (
    ['tenths', 'hundredths', 'thousandths', 'ten-thousandths', 'hundred-thousandths', 'millionths'][
      -real - 1
    ] ?? `10^${real} place`
  );
}
