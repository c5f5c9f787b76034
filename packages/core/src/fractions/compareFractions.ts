import { gcd } from '../numbers/digits.js';
import type { Fraction } from '../parse/types.js';
import type { FractionComparisonTrace } from '../trace/types.js';

/**
 * Compares two fractions over a common denominator; with `habit: 'denominators'` it
 * compares the denominators alone, as `frac.larger-denominator-larger` does (only for
 * equal numerators; null otherwise).
 * `compareFractions({ numerator: 3, denominator: 8 }, { numerator: 1, denominator: 2 }).sign` → `'<'`.
 */
export function compareFractions(
  left: Fraction,
  right: Fraction,
  habit: 'values' | 'denominators' = 'values',
): FractionComparisonTrace | null {
  const common = (left.denominator / gcd(left.denominator, right.denominator)) * right.denominator;
  const leftScaled = {
    numerator: (left.numerator * common) / left.denominator,
    denominator: common,
    factor: common / left.denominator,
  };
  const rightScaled = {
    numerator: (right.numerator * common) / right.denominator,
    denominator: common,
    factor: common / right.denominator,
  };
  let sign: '<' | '>' | '=';
  if (habit === 'denominators') {
    if (left.numerator !== right.numerator) return null;
    sign =
      left.denominator > right.denominator ? '>' : left.denominator < right.denominator ? '<' : '=';
  } else {
    sign =
      leftScaled.numerator > rightScaled.numerator
        ? '>'
        : leftScaled.numerator < rightScaled.numerator
          ? '<'
          : '=';
  }
  return {
    kind: 'fraction-comparison',
    left,
    right,
    basis: habit === 'denominators' ? 'denominators' : 'common-denominator',
    commonDenominator: common,
    leftScaled,
    rightScaled,
    sign,
    result: sign,
  };
}
