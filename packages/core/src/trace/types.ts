// The working trace: a working laid out as plain data so the web can draw it on squared
// paper and the API can store it as JSON. One shape per written method, told apart by
// `kind`. Columns are listed ones first (`index` 0 is the ones column, 1 the tens …);
// every `place` is the column's name ('ones', 'tens', …). The same shapes carry the
// correct working and, when an error rule reproduces the answer, the child's working.

import type { Fraction, Operation } from '../parse/types.js';

/** A number as written in a row of a column layout; `shift` = how many columns it sits left of right-aligned. */
export interface Row {
  readonly digits: string;
  readonly shift: number;
}

/** One column of column addition. */
export interface AdditionColumn {
  readonly index: number;
  readonly place: string;
  /** The digit of each row in this column, top row first; `null` where the row has no digit. */
  readonly digits: readonly (number | null)[];
  /** Carried into this column from the right (drawn small above it). */
  readonly carryIn: number;
  /** The column sum as worked: the digits plus the carry. */
  readonly sum: number;
  /** What is written under the line in this column (more than one digit only where a method writes a whole sum). */
  readonly written: string;
  /** Carried out to the next column on the left. */
  readonly carryOut: number;
}

export interface ColumnAdditionTrace {
  readonly kind: 'column-addition';
  readonly rows: readonly Row[];
  readonly columns: readonly AdditionColumn[];
  readonly result: string;
  /** For decimals: the point stands this many columns from the right, in every row (rows and result are digits only). */
  readonly point?: number;
}

/** One column of column subtraction. */
export interface SubtractionColumn {
  readonly index: number;
  readonly place: string;
  readonly top: number | null;
  readonly bottom: number | null;
  /**
   * Every value the top digit takes, in order: the digit as written, then each value it is
   * crossed out and rewritten as while regrouping (304 − 75, tens column: `[0, 10, 9]`).
   */
  readonly marks: readonly number[];
  /** The top value the column's fact starts from (the last mark). */
  readonly used: number;
  /** The digit written under the line. */
  readonly written: number;
}

/** One regrouping (borrow): a ten taken from column `from` into column `to`. */
export interface Regrouping {
  /** The column that lends, or `null` when nothing was taken from anywhere. */
  readonly from: number | null;
  readonly to: number;
  /**
   * `regroup` — the usual exchange of one for ten; `skip-zeros` — taken past zero columns
   * from the nearest non-zero digit; `zero-to-nine` — a 0 changed to 9 with nothing taken
   * further left; `no-decrement` — ten added without taking one anywhere.
   */
  readonly kind: 'regroup' | 'skip-zeros' | 'zero-to-nine' | 'no-decrement';
}

export interface ColumnSubtractionTrace {
  readonly kind: 'column-subtraction';
  readonly top: Row;
  readonly bottom: Row;
  readonly columns: readonly SubtractionColumn[];
  /** Regroupings in the order they were done. */
  readonly regroupings: readonly Regrouping[];
  readonly result: string;
  /** For decimals: the point stands this many columns from the right (digits only elsewhere). */
  readonly point?: number;
}

/** One digit-by-digit product inside a partial product. */
export interface ProductCell {
  /** Column of the top digit (ones first). */
  readonly index: number;
  readonly topDigit: number;
  readonly multiplierDigit: number;
  /** The basic fact's result as used (7 × 8 → 56). */
  readonly product: number;
  readonly carryIn: number;
  readonly written: string;
  readonly carryOut: number;
}

/** One partial product: the top number times one digit of the multiplier. */
export interface PartialProduct {
  /** Which multiplier digit (0 = ones digit). */
  readonly multiplierIndex: number;
  readonly multiplierDigit: number;
  readonly cells: readonly ProductCell[];
  /** The digits written for this partial product, without placeholder zeros. */
  readonly digits: string;
  /** Columns it is moved to the left (placeholder zeros). */
  readonly shift: number;
  /** Its value: the digits followed by `shift` zeros. */
  readonly value: string;
}

export interface LongMultiplicationTrace {
  readonly kind: 'long-multiplication';
  readonly top: string;
  readonly bottom: string;
  readonly partials: readonly PartialProduct[];
  /** Adding the partial products (absent with a one-digit multiplier). */
  readonly sum: ColumnAdditionTrace | null;
  /** When the zeros at the ends were set aside, multiplied without them and put back. */
  readonly zeros: {
    readonly top: number;
    readonly bottom: number;
    readonly appended: number;
  } | null;
  readonly result: string;
  /** For decimals: the point stands this many columns from the right (digits only elsewhere). */
  readonly point?: number;
}

/** One divide–multiply–subtract–bring-down step of long division. */
export interface DivisionStep {
  /** Position in the dividend (from the left) of the last digit used in `number`. */
  readonly position: number;
  /** The number being divided in this step. */
  readonly number: number;
  /** The quotient digit written, or `null` when none was written. */
  readonly quotientDigit: number | null;
  /** Place of this quotient digit in the quotient ('tens', …). */
  readonly quotientPlace: string;
  /** quotient digit × divisor. */
  readonly product: number;
  /** number − product. */
  readonly difference: number;
  /** The next digit brought down, or `null` at the end. */
  readonly broughtDown: number | null;
}

export interface LongDivisionTrace {
  readonly kind: 'long-division';
  readonly dividend: string;
  readonly divisor: string;
  readonly steps: readonly DivisionStep[];
  readonly quotient: string;
  readonly remainder: string;
  /** The answer as written: `'7 R 3'`, `'102'`, or `'7.3'`. */
  readonly result: string;
}

export interface RoundingTrace {
  readonly kind: 'rounding';
  readonly value: string;
  /** The place rounded to, e.g. `'hundreds'`, and its power of ten. */
  readonly place: string;
  readonly exponent: number;
  /** The digit in that place. */
  readonly placeDigit: number;
  /** The digit just to its right, which decides (0 when there is none). */
  readonly decidingDigit: number;
  readonly decidingPlace: string;
  readonly direction: 'up' | 'down';
  /** The rule as applied, in words. */
  readonly rule: string;
  /** Intermediate values when a method rounds in several steps. */
  readonly steps: readonly string[];
  readonly result: string;
}

export interface MissingNumberTrace {
  readonly kind: 'missing-number';
  readonly equation: string;
  /** The computation that finds the missing number: `{ op: '−', a: '90', b: '35', result: '55' }`. */
  readonly inverse: {
    readonly op: Operation;
    readonly a: string;
    readonly b: string;
    readonly result: string;
  };
  /** The equation with the number filled in, e.g. `'90 − 55 = 35'`. */
  readonly check: string;
  /** The written working of the inverse computation, when it is a column method. */
  readonly working: WorkingTrace | null;
  readonly result: string;
}

/** A fraction rewritten over another denominator: 1/2 → 3/6 with factor 3. */
export interface ScaledFraction {
  readonly numerator: number;
  readonly denominator: number;
  readonly factor: number;
}

export interface FractionSumTrace {
  readonly kind: 'fraction-sum';
  readonly op: '+' | '−';
  readonly left: Fraction;
  readonly right: Fraction;
  /** The common denominator used, or `null` when the method did not find one. */
  readonly commonDenominator: number | null;
  readonly leftScaled: ScaledFraction | null;
  readonly rightScaled: ScaledFraction | null;
  /** The fraction the method writes before simplifying. */
  readonly unsimplified: Fraction;
  /** Simplest form and the number both parts were divided by. */
  readonly simplified: Fraction & { readonly divisor: number };
  /** As a mixed number when more than one whole, e.g. `'1 1/4'`. */
  readonly mixed: string | null;
  readonly result: string;
}

export interface FractionComparisonTrace {
  readonly kind: 'fraction-comparison';
  readonly left: Fraction;
  readonly right: Fraction;
  /** What is compared: both fractions over a common denominator, or (for a rule) the denominators alone. */
  readonly basis: 'common-denominator' | 'denominators';
  readonly commonDenominator: number;
  readonly leftScaled: ScaledFraction;
  readonly rightScaled: ScaledFraction;
  readonly sign: '<' | '>' | '=';
  readonly result: string;
}

/** Two decimals compared: each written with as many places as the other, then compared. */
export interface DecimalComparisonTrace {
  readonly kind: 'decimal-comparison';
  readonly left: string;
  readonly right: string;
  /** Both with the same number of digits after the point (0.5 → 0.50 beside 0.45). */
  readonly padded: readonly [string, string];
  /** What the comparison went by, in words. */
  readonly basis: string;
  readonly sign: '<' | '>' | '=';
  readonly result: string;
}

/** Hours and minutes added or subtracted, a line of working a step. */
export interface ClockTrace {
  readonly kind: 'clock';
  readonly op: '+' | '−';
  readonly left: string;
  readonly right: string;
  /** The working in words and numbers, e.g. `['15 min is less than 50 min: take 1 h as 60 min', …]`. */
  readonly steps: readonly string[];
  readonly result: string;
}

/** A working laid out for drawing; see each member's doc. */
export type WorkingTrace =
  | ColumnAdditionTrace
  | ColumnSubtractionTrace
  | LongMultiplicationTrace
  | LongDivisionTrace
  | RoundingTrace
  | MissingNumberTrace
  | FractionSumTrace
  | FractionComparisonTrace
  | DecimalComparisonTrace
  | ClockTrace;

export type WorkingTraceKind = WorkingTrace['kind'];
