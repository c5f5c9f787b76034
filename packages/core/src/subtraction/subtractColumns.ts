import { digitsOf, placeName, stripLeadingZeros } from '../numbers/digits.js';
import type { ColumnSubtractionTrace, Regrouping, SubtractionColumn } from '../trace/types.js';

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
}

export interface SubtractionRun {
  readonly result: string;
  readonly trace: ColumnSubtractionTrace;
  /** Columns where the method did something the correct method would not, and which part of it. */
  readonly fired: readonly { readonly column: number; readonly part: keyof SubtractionMethod }[];
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
  const align = method.align ?? 'right';
  const compare = method.compare ?? 'regroup';
  const decrement = method.decrement ?? true;
  const zeros = method.zeros ?? 'through';
  const zeroTop = method.zeroTop ?? 'regroup';
  const minusZero = method.minusZero ?? 'n';
  const n = top.length;
  const shift = align === 'left' ? n - bottom.length : 0;
  const topDigits = digitsOf(top);
  const cur = topDigits.slice();
  const marks: number[][] = topDigits.map((d) => [d]);
  const bottomDigits = digitsOf(bottom);
  const bottomAt = (k: number): number | null =>
    k - shift >= 0 ? (bottomDigits[k - shift] ?? null) : null;
  const regroupings: Regrouping[] = [];
  const fired: { column: number; part: keyof SubtractionMethod }[] = [];
  const written: number[] = [];
  const lend = (from: number, to: number): void => {
    cur[from] = (cur[from] as number) - 1;
    (marks[from] as number[]).push(cur[from] as number);
    cur[to] = (cur[to] as number) + 10;
    (marks[to] as number[]).push(cur[to] as number);
  };

  for (let k = 0; k < n; k += 1) {
    const t = cur[k] as number;
    const b = bottomAt(k);
    const bv = b ?? 0;
    if (shift > 0 && b !== (bottomDigits[k] ?? null)) fired.push({ column: k, part: 'align' });
    if (zeroTop !== 'regroup' && t === 0 && b !== null && b > 0) {
      written.push(zeroTop === 'n' ? b : 0);
      fired.push({ column: k, part: 'zeroTop' });
      continue;
    }
    if (minusZero === 'zero' && b === 0 && t > 0) {
      written.push(0);
      fired.push({ column: k, part: 'minusZero' });
      continue;
    }
    if (t >= bv) {
      written.push(t - bv);
      continue;
    }
    if (compare === 'smaller-from-larger') {
      written.push(bv - t);
      fired.push({ column: k, part: 'compare' });
      continue;
    }
    if (!decrement) {
      cur[k] = t + 10;
      (marks[k] as number[]).push(t + 10);
      regroupings.push({ from: null, to: k, kind: 'no-decrement' });
      written.push(t + 10 - bv);
      fired.push({ column: k, part: 'decrement' });
      continue;
    }
    if (k + 1 >= n) return null;
    if (cur[k + 1] !== 0) {
      lend(k + 1, k);
      regroupings.push({ from: k + 1, to: k, kind: 'regroup' });
    } else if (zeros === 'stop') {
      cur[k + 1] = 9;
      (marks[k + 1] as number[]).push(9);
      cur[k] = t + 10;
      (marks[k] as number[]).push(t + 10);
      regroupings.push({ from: k + 1, to: k, kind: 'zero-to-nine' });
      fired.push({ column: k, part: 'zeros' });
    } else {
      let j = k + 1;
      while (j < n && cur[j] === 0) j += 1;
      if (j >= n) return null;
      if (zeros === 'skip') {
        cur[j] = (cur[j] as number) - 1;
        (marks[j] as number[]).push(cur[j] as number);
        cur[k] = t + 10;
        (marks[k] as number[]).push(t + 10);
        regroupings.push({ from: j, to: k, kind: 'skip-zeros' });
        fired.push({ column: k, part: 'zeros' });
      } else {
        for (let m = j; m > k; m -= 1) {
          lend(m, m - 1);
          regroupings.push({ from: m, to: m - 1, kind: 'regroup' });
        }
      }
    }
    written.push((cur[k] as number) - bv);
  }

  const columns: SubtractionColumn[] = [];
  let text = '';
  for (let k = 0; k < n; k += 1) {
    const m = marks[k] as number[];
    columns.push({
      index: k,
      place: placeName(k),
      top: topDigits[k] as number,
      bottom: bottomAt(k),
      marks: m,
      used: m[m.length - 1] as number,
      written: written[k] as number,
    });
    text = String(written[k]) + text;
  }
  const result = stripLeadingZeros(text);
  return {
    result,
    trace: {
      kind: 'column-subtraction',
      top: { digits: top, shift: 0 },
      bottom: { digits: bottom, shift },
      columns,
      regroupings,
      result,
    },
    fired,
  };
}
