import { addColumns } from '../addition/addColumns.js';
import { digitsOf, stripLeadingZeros } from '../numbers/digits.js';
import type {
  ColumnAdditionTrace,
  LongMultiplicationTrace,
  PartialProduct,
  ProductCell,
} from '../trace/types.js';

/**
 * How carries are handled inside a partial product: `add` (correct: add the carry after
 * multiplying), `before` (add it to the next top digit, then multiply), `drop` (carry
 * nothing), `write` (write each whole product), `reverse` (write the tens digit, carry the ones).
 */
export type ProductCarry = 'add' | 'before' | 'drop' | 'write' | 'reverse';

/** A way of doing long multiplication; the defaults are the correct method. */
export interface MultiplicationMethod {
  readonly carry?: ProductCarry;
  /** `zero` (correct) or `n`: a 0 digit times N taken as N. */
  readonly zeroDigit?: 'zero' | 'n';
  /** `shift` (correct: move each partial product one more place left) or `none`. */
  readonly placeholder?: 'shift' | 'none';
  /** A basic-fact slip: the product of this cell (partial product, top-digit column) taken as `product`; its effect carries on. */
  readonly slip?: { readonly partial: number; readonly column: number; readonly product: number };
  /** A one-off slip: the carry into this cell (partial product, top-digit column) is not added, once. */
  readonly dropCarryAt?: { readonly partial: number; readonly column: number };
}

export interface MultiplicationRun {
  readonly result: string;
  readonly trace: LongMultiplicationTrace;
  /** Where the method departed from the correct one: partial product, top-digit column, and which part. */
  readonly fired: readonly {
    readonly partial: number;
    readonly column: number;
    readonly part: Exclude<keyof MultiplicationMethod, 'slip' | 'dropCarryAt'>;
  }[];
}

/**
 * Long multiplication of `top` by `bottom` (top written above): one partial product per
 * multiplier digit, each shifted one place further left, then added in columns.
 * `record: false` (for the many trial runs of diagnosis) adds the partial products as numbers
 * and leaves the column addition out of the trace (`sum: null`); the result is the same.
 * `multiplyLong('27', '4').result` → `'108'`;
 * `multiplyLong('27', '4', { carry: 'drop' }).result` → `'88'`.
 */
export function multiplyLong(
  top: string,
  bottom: string,
  method: MultiplicationMethod = {},
  record = true,
): MultiplicationRun {
  const carryHabit = method.carry ?? 'add';
  const zeroDigit = method.zeroDigit ?? 'zero';
  const placeholder = method.placeholder ?? 'shift';
  const t = digitsOf(top);
  const b = digitsOf(bottom);
  const fired: {
    partial: number;
    column: number;
    part: Exclude<keyof MultiplicationMethod, 'slip' | 'dropCarryAt'>;
  }[] = [];
  const slip = method.slip;
  const partials: PartialProduct[] = [];
  for (let j = 0; j < b.length; j += 1) {
    const d = b[j] as number;
    const cells: ProductCell[] = [];
    let carry = 0;
    let digits = '';
    for (let i = 0; i < t.length; i += 1) {
      const top1 = t[i] as number;
      const leftmost = i === t.length - 1;
      const dropped =
        method.dropCarryAt !== undefined &&
        method.dropCarryAt.partial === j &&
        method.dropCarryAt.column === i;
      const carryIn = dropped ? 0 : carry;
      let factor = top1;
      if (carryHabit === 'before' && carryIn > 0) {
        factor = top1 + carryIn;
        fired.push({ partial: j, column: i, part: 'carry' });
      }
      let product = factor * d;
      if (zeroDigit === 'n' && (factor === 0) !== (d === 0)) {
        product = factor === 0 ? d : factor;
        fired.push({ partial: j, column: i, part: 'zeroDigit' });
      }
      if (slip !== undefined && slip.partial === j && slip.column === i) product = slip.product;
      const total = carryHabit === 'add' || carryHabit === 'reverse' ? product + carryIn : product;
      let written: string;
      carry = 0;
      if (leftmost) written = String(total);
      else if (total < 10) written = String(total);
      else if (carryHabit === 'add' || carryHabit === 'before') {
        written = String(total % 10);
        carry = Math.floor(total / 10);
      } else if (carryHabit === 'drop') {
        written = String(total % 10);
        fired.push({ partial: j, column: i, part: 'carry' });
      } else if (carryHabit === 'write') {
        written = String(total);
        fired.push({ partial: j, column: i, part: 'carry' });
      } else {
        written = String(Math.floor(total / 10));
        carry = total % 10;
        fired.push({ partial: j, column: i, part: 'carry' });
      }
      cells.push({
        index: i,
        topDigit: top1,
        multiplierDigit: d,
        product,
        carryIn,
        written,
        carryOut: carry,
      });
      digits = written + digits;
    }
    digits = stripLeadingZeros(digits);
    const shift = placeholder === 'shift' ? j : 0;
    if (placeholder === 'none' && j > 0) fired.push({ partial: j, column: 0, part: 'placeholder' });
    const value = digits === '0' ? '0' : digits + '0'.repeat(shift);
    partials.push({ multiplierIndex: j, multiplierDigit: d, cells, digits, shift, value });
  }
  let sum: ColumnAdditionTrace | null = null;
  let result = (partials[0] as PartialProduct).value;
  if (partials.length > 1) {
    if (record) {
      sum = addColumns(partials.map((p) => p.value)).trace;
      result = sum.result;
    } else {
      let total = 0n;
      for (const p of partials) total += BigInt(p.value);
      result = total.toString();
    }
  }
  return {
    result,
    trace: { kind: 'long-multiplication', top, bottom, partials, sum, zeros: null, result },
    fired,
  };
}
