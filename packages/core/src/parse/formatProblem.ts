import type { Fraction, Operation } from './types.js';

/** `formatExpression(['304', '75'], '−')` → `'304 − 75'`. */
export function formatExpression(terms: readonly string[], op: Operation | '+' | '−'): string {
  return terms.join(` ${op} `);
}

/** `formatFraction({ numerator: 3, denominator: 8 })` → `'3/8'`. */
export function formatFraction(f: Fraction): string {
  return `${f.numerator}/${f.denominator}`;
}
