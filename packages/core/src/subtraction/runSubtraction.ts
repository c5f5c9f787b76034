import { digitsOf, placeName, stripLeadingZeros } from '../numbers/digits.js';
import type { ColumnSubtractionTrace, Regrouping, SubtractionColumn } from '../trace/types.js';
import type { SubtractionMethod, SubtractionRun } from './subtractColumns.js';

/**
 * The column-subtraction method itself; `record: false` skips building the trace (for the
 * many trial runs of diagnosis). Use `subtractColumns` for the working.
 * `runSubtraction('304', '75', {}, false)?.result` → `'229'`.
 */
export function runSubtraction(
  top: string,
  bottom: string,
  method: SubtractionMethod,
  record: boolean,
): (Omit<SubtractionRun, 'trace'> & { trace: ColumnSubtractionTrace | null }) | null {
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
  const marks: number[][] = record ? topDigits.map((d) => [d]) : [];
  const bottomDigits = digitsOf(bottom);
  const bottomAt = (k: number): number | null =>
    k - shift >= 0 ? (bottomDigits[k - shift] ?? null) : null;
  const regroupings: Regrouping[] = [];
  const fired: { column: number; part: Exclude<keyof SubtractionMethod, 'slip'> }[] = [];
  const written: number[] = [];
  const slip = method.slip;
  // A slip only replaces a difference actually worked out (not a 0 − N or N − 0 written by rote).
  const differ = (k: number, value: number): number =>
    slip !== undefined && slip.column === k ? slip.difference : value;
  const lend = (from: number, to: number): void => {
    cur[from] = (cur[from] as number) - 1;
    if (record) (marks[from] as number[]).push(cur[from] as number);
    cur[to] = (cur[to] as number) + 10;
    if (record) (marks[to] as number[]).push(cur[to] as number);
  };

  for (let k = 0; k < n; k += 1) {
    const t = cur[k] as number;
    const b = bottomAt(k);
    const bv = b ?? 0;
    if (shift > 0 && b !== (bottomDigits[k] ?? null)) fired.push({ column: k, part: 'align' });
    if (zeroTop !== 'regroup' && t === 0 && b !== null && b > 0) {
      if (slip !== undefined && slip.column === k) return null;
      written.push(zeroTop === 'n' ? b : 0);
      fired.push({ column: k, part: 'zeroTop' });
      continue;
    }
    if (minusZero === 'zero' && b === 0 && t > 0) {
      if (slip !== undefined && slip.column === k) return null;
      written.push(0);
      fired.push({ column: k, part: 'minusZero' });
      continue;
    }
    if (t >= bv) {
      written.push(differ(k, t - bv));
      continue;
    }
    if (compare === 'smaller-from-larger') {
      written.push(differ(k, bv - t));
      fired.push({ column: k, part: 'compare' });
      continue;
    }
    if (!decrement) {
      cur[k] = t + 10;
      if (record) (marks[k] as number[]).push(t + 10);
      regroupings.push({ from: null, to: k, kind: 'no-decrement' });
      written.push(differ(k, t + 10 - bv));
      fired.push({ column: k, part: 'decrement' });
      continue;
    }
    if (k + 1 >= n) return null;
    if (cur[k + 1] !== 0) {
      lend(k + 1, k);
      regroupings.push({ from: k + 1, to: k, kind: 'regroup' });
    } else if (zeros === 'stop') {
      cur[k + 1] = 9;
      if (record) (marks[k + 1] as number[]).push(9);
      cur[k] = t + 10;
      if (record) (marks[k] as number[]).push(t + 10);
      regroupings.push({ from: k + 1, to: k, kind: 'zero-to-nine' });
      fired.push({ column: k, part: 'zeros' });
    } else {
      let j = k + 1;
      while (j < n && cur[j] === 0) j += 1;
      if (j >= n) return null;
      if (zeros === 'skip') {
        cur[j] = (cur[j] as number) - 1;
        if (record) (marks[j] as number[]).push(cur[j] as number);
        cur[k] = t + 10;
        if (record) (marks[k] as number[]).push(t + 10);
        regroupings.push({ from: j, to: k, kind: 'skip-zeros' });
        fired.push({ column: k, part: 'zeros' });
      } else {
        for (let m = j; m > k; m -= 1) {
          lend(m, m - 1);
          regroupings.push({ from: m, to: m - 1, kind: 'regroup' });
        }
      }
    }
    written.push(differ(k, (cur[k] as number) - bv));
  }

  let text = '';
  for (let k = n - 1; k >= 0; k -= 1) text += String(written[k]);
  const result = stripLeadingZeros(text);
  if (!record) return { result, trace: null, fired };
  const columns: SubtractionColumn[] = [];
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
  }
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
