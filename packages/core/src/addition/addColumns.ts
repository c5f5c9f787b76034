import { digitsOf, placeName, stripLeadingZeros } from '../numbers/digits.js';
import type { AdditionColumn, ColumnAdditionTrace, Row } from '../trace/types.js';

/**
 * How a column sum of 10 or more is handled: `regroup` (correct: write the ones digit,
 * carry the tens), `drop` (write the ones digit, carry nothing), `write-sum` (write the
 * whole sum), `reverse` (write the tens digit, carry the ones digit), `write-carry`
 * (write the carried digit in the column, carry nothing).
 */
export type CarryHabit = 'regroup' | 'drop' | 'write-sum' | 'reverse' | 'write-carry';

/** A way of doing column addition; the defaults are the correct method. */
export interface AdditionMethod {
  readonly align?: 'right' | 'left';
  readonly carry?: CarryHabit;
  /** A basic-fact slip: the sum in this column (digits plus carry) taken as `sum`; its effect carries on to the left. */
  readonly slip?: { readonly column: number; readonly sum: number };
}

/** The outcome of running a column-addition method. */
export interface AdditionRun {
  readonly result: string;
  readonly trace: ColumnAdditionTrace;
  /** Columns where the method did something the correct method would not, and which part of it. */
  readonly fired: readonly {
    readonly column: number;
    readonly part: Exclude<keyof AdditionMethod, 'slip'>;
  }[];
}

/**
 * Column addition, right to left, with the given method (correct by default).
 * `addColumns(['58', '67']).result` → `'125'`;
 * `addColumns(['58', '67'], { carry: 'drop' }).result` → `'115'`.
 */
export function addColumns(addends: readonly string[], method: AdditionMethod = {}): AdditionRun {
  const align = method.align ?? 'right';
  const habit = method.carry ?? 'regroup';
  let width = 0;
  for (const a of addends) if (a.length > width) width = a.length;
  const rows: Row[] = addends.map((a) => ({
    digits: a,
    shift: align === 'left' ? width - a.length : 0,
  }));
  const rowDigits = addends.map((a) => digitsOf(a));
  const columns: AdditionColumn[] = [];
  const fired: { column: number; part: Exclude<keyof AdditionMethod, 'slip'> }[] = [];
  const parts: string[] = [];
  let carryIn = 0;
  for (let k = 0; k < width; k += 1) {
    const digits: (number | null)[] = [];
    let s = 0;
    let shiftedHere = false;
    for (let r = 0; r < rows.length; r += 1) {
      const shift = (rows[r] as Row).shift;
      const ds = rowDigits[r] as number[];
      const d = k - shift >= 0 ? (ds[k - shift] ?? null) : null;
      if (shift > 0 && (ds[k] ?? null) !== d) shiftedHere = true;
      digits.push(d);
      if (d !== null) s += d;
    }
    const sum =
      method.slip !== undefined && method.slip.column === k ? method.slip.sum : s + carryIn;
    const leftmost = k === width - 1;
    let written: string;
    let carryOut = 0;
    let departs = false;
    if (leftmost && habit !== 'write-carry') {
      written = String(sum);
    } else if (sum < 10) {
      written = String(sum);
    } else {
      switch (habit) {
        case 'regroup':
          written = String(sum % 10);
          carryOut = Math.floor(sum / 10);
          break;
        case 'drop':
          written = String(sum % 10);
          departs = true;
          break;
        case 'write-sum':
          written = String(sum);
          departs = true;
          break;
        case 'reverse':
          written = String(Math.floor(sum / 10));
          carryOut = sum % 10;
          departs = true;
          break;
        case 'write-carry':
          written = String(Math.floor(sum / 10));
          departs = true;
          break;
      }
    }
    if (shiftedHere) fired.push({ column: k, part: 'align' });
    if (departs) fired.push({ column: k, part: 'carry' });
    columns.push({ index: k, place: placeName(k), digits, carryIn, sum, written, carryOut });
    parts.push(written);
    carryIn = carryOut;
  }
  let text = '';
  for (let k = parts.length - 1; k >= 0; k -= 1) text += parts[k] as string;
  const result = stripLeadingZeros(text === '' ? '0' : text);
  return { result, trace: { kind: 'column-addition', rows, columns, result }, fired };
}
