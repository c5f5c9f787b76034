import type { ColumnSubtractionTrace } from '../trace/types.js';
import { runSubtraction } from './runSubtraction.js';

/** A way of doing column subtraction; every default is the correct method. */
export interface SubtractionMethod {
  readonly align?: 'right' | 'left';
  /** `regroup` (correct) or `smaller-from-larger`: take the smaller digit from the larger. */
  readonly compare?: 'regroup' | 'smaller-from-larger';
  /** Whether the lending digit is reduced by one (`false`: ten added, nothing taken). */
  readonly decrement?: boolean;
  /** Regrouping from a 0: `through` (correct, step by step), `skip` the zeros, or `stop` after changing it to 9. */
  readonly zeros?: 'through' | 'skip' | 'stop';
  /** A column 0 − N: `regroup` (correct), written as `n`, or written as `zero`. */
  readonly zeroTop?: 'regroup' | 'n' | 'zero';
  /** A column N − 0: `n` (correct) or written as `zero`. */
  readonly minusZero?: 'n' | 'zero';
  /** A basic-fact slip: the difference worked out in this column written as `difference` (0–9). */
  readonly slip?: { readonly column: number; readonly difference: number };
}

export interface SubtractionRun {
  readonly result: string;
  readonly trace: ColumnSubtractionTrace;
  /** Columns where the method did something the correct method would not, and which part of it. */
  readonly fired: readonly {
    readonly column: number;
    readonly part: Exclude<keyof SubtractionMethod, 'slip'>;
  }[];
}

/**
 * Column subtraction, top minus bottom, right to left, with the given method (correct by
 * default). Returns `null` when the method cannot finish (it needs to take from a column
 * that is not there).
 * `subtractColumns('304', '75')?.result` → `'229'`;
 * `subtractColumns('304', '75', { zeros: 'skip' })?.result` → `'139'`.
 */
export function subtractColumns(
  top: string,
  bottom: string,
  method: SubtractionMethod = {},
): SubtractionRun | null {
  const run = runSubtraction(top, bottom, method, true);
  return run === null ? null : (run as SubtractionRun);
}
