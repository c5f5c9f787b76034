import { placeName } from '../numbers/digits.js';
import type { RoundingTrace } from '../trace/types.js';

/**
 * How a child rounds: `half-up` (the school rule, correct), `truncate`, `half-down`,
 * `wrong-place`, `chained`, `carry-lost`, `keep-lower` (see the `round.*` rules).
 */
export type RoundingHabit =
  'half-up' | 'truncate' | 'half-down' | 'wrong-place' | 'chained' | 'carry-lost' | 'keep-lower';

const halfUp = (v: bigint, unit: bigint): bigint => {
  const rest = v % unit;
  return v - rest + (rest * 2n >= unit ? unit : 0n);
};

/**
 * Rounds a whole number to the place 10^exponent with the given habit (the school rule by
 * default: a 5 or more in the next place rounds up, then zeros after the place). Returns
 * null when the habit does not apply (e.g. no 9 to carry past).
 * `roundToPlace('3456', 2)?.result` → `'3500'`; `roundToPlace('3449', 2, 'chained')?.result` → `'3500'`.
 */
export function roundToPlace(
  value: string,
  exponent: number,
  habit: RoundingHabit = 'half-up',
): RoundingTrace | null {
  const v = BigInt(value);
  const unit = 10n ** BigInt(exponent);
  const digitAt = (k: number): number => Number((v / 10n ** BigInt(k)) % 10n);
  const placeDigit = digitAt(exponent);
  const decidingDigit = exponent > 0 ? digitAt(exponent - 1) : 0;
  const rest = v % unit;
  const up = rest * 2n >= unit;
  const steps: string[] = [];
  let result: bigint;
  let rule: string;
  switch (habit) {
    case 'half-up':
      result = halfUp(v, unit);
      rule = up
        ? `The ${placeName(exponent - 1)} digit is ${decidingDigit}, which is 5 or more, so the ${placeName(exponent)} digit goes up by one and the digits after it become 0.`
        : `The ${placeName(exponent - 1)} digit is ${decidingDigit}, which is less than 5, so the ${placeName(exponent)} digit stays and the digits after it become 0.`;
      break;
    case 'truncate':
      if (!up) return null;
      result = v - rest;
      rule = `The ${placeName(exponent)} digit ${placeDigit} was kept and the digits after it dropped, whatever they were.`;
      break;
    case 'half-down':
      if (rest * 2n !== unit) return null;
      result = v - rest;
      rule = `The deciding 5 had nothing after it, and it was rounded down.`;
      break;
    case 'wrong-place':
      if (exponent === 0) return null;
      result = halfUp(v, unit / 10n);
      rule = `It was rounded to the nearest ${placeName(exponent - 1).replace(/s$/, '')} instead of the nearest ${placeName(exponent).replace(/s$/, '')}.`;
      break;
    case 'chained': {
      let current = v;
      for (let k = 1; k <= exponent; k += 1) {
        current = halfUp(current, 10n ** BigInt(k));
        steps.push(current.toString());
      }
      result = current;
      rule =
        'It was rounded one place at a time, from the ones up, each step using the digit the last step changed.';
      break;
    }
    case 'carry-lost':
      if (!up || placeDigit !== 9) return null;
      result = v - (v % (unit * 10n));
      rule = `The ${placeName(exponent)} digit 9 had to round up; it became 0, but the 1 was not carried into the ${placeName(exponent + 1)}.`;
      break;
    case 'keep-lower':
      if (rest === 0n) return null;
      result = up ? v + unit : v;
      rule = `The ${placeName(exponent)} digit was ${up ? 'rounded up' : 'kept'} correctly, but the digits after it were kept instead of becoming 0.`;
      break;
  }
  return {
    kind: 'rounding',
    value,
    place: placeName(exponent),
    exponent,
    placeDigit,
    decidingDigit,
    decidingPlace: exponent > 0 ? placeName(exponent - 1) : 'none',
    direction: up ? 'up' : 'down',
    rule,
    steps,
    result: result.toString(),
  };
}
