import { gcd } from '../numbers/digits.js';
import type { Fraction } from '../parse/types.js';
import type { FractionSumTrace } from '../trace/types.js';

/**
 * How fractions are added or subtracted: `common-denominator` (correct), `across`
 * (numerators and denominators separately), `numerator-only` with the left or right
 * denominator kept.
 */
export type FractionHabit =
  'common-denominator' | 'across' | 'numerator-only-left' | 'numerator-only-right';

const lcm = (a: number, b: number): number => (a / gcd(a, b)) * b;

function finish(
  op: '+' | '−',
  left: Fraction,
  right: Fraction,
  unsimplified: Fraction,
  common: number | null,
): FractionSumTrace {
  const g =
    unsimplified.numerator === 0
      ? unsimplified.denominator
      : gcd(unsimplified.numerator, unsimplified.denominator);
  const simplified = {
    numerator: unsimplified.numerator / g,
    denominator: unsimplified.denominator / g,
    divisor: g,
  };
  const whole = Math.floor(simplified.numerator / simplified.denominator);
  const rest = simplified.numerator % simplified.denominator;
  const mixed = whole >= 1 && rest > 0 ? `${whole} ${rest}/${simplified.denominator}` : null;
  const result =
    simplified.denominator === 1
      ? String(simplified.numerator)
      : `${simplified.numerator}/${simplified.denominator}`;
  const scale = (f: Fraction) =>
    common === null
      ? null
      : {
          numerator: (f.numerator * common) / f.denominator,
          denominator: common,
          factor: common / f.denominator,
        };
  return {
    kind: 'fraction-sum',
    op,
    left,
    right,
    commonDenominator: common,
    leftScaled: scale(left),
    rightScaled: scale(right),
    unsimplified,
    simplified,
    mixed,
    result,
  };
}

/**
 * Adds or subtracts two fractions: rewrite both over the least common denominator, add or
 * subtract the numerators, simplify. Other habits give the rule methods; null when the
 * habit gives no fraction (a zero or negative part).
 * `addFractions({ numerator: 1, denominator: 2 }, '+', { numerator: 1, denominator: 3 }).result` → `'5/6'`;
 * with `'across'` → `'2/5'`.
 */
export function addFractions(
  left: Fraction,
  op: '+' | '−',
  right: Fraction,
  habit: FractionHabit = 'common-denominator',
): FractionSumTrace | null {
  const sign = op === '+' ? 1 : -1;
  if (habit === 'common-denominator') {
    const common = lcm(left.denominator, right.denominator);
    const n =
      (left.numerator * common) / left.denominator +
      sign * ((right.numerator * common) / right.denominator);
    if (n < 0) return null;
    return finish(op, left, right, { numerator: n, denominator: common }, common);
  }
  if (habit === 'across') {
    const n = left.numerator + sign * right.numerator;
    const d = left.denominator + sign * right.denominator;
    if (n < 0 || d <= 0) return null;
    return finish(op, left, right, { numerator: n, denominator: d }, null);
  }
  if (left.denominator === right.denominator) return null;
  const n = left.numerator + sign * right.numerator;
  if (n < 0) return null;
  const d = habit === 'numerator-only-left' ? left.denominator : right.denominator;
  return finish(op, left, right, { numerator: n, denominator: d }, null);
}
