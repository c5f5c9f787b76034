// The parsed forms of a problem and of a child's answer. Whole numbers are kept as
// digit strings (no commas, no leading zeros) so that long numbers stay exact and the
// parsed problem can be stored as plain JSON.

/** A fraction as written, e.g. `{ numerator: 3, denominator: 8 }` for 3/8. */
export interface Fraction {
  readonly numerator: number;
  readonly denominator: number;
}

/** The four operations, in the symbols Workback prints. */
export const Operation = {
  add: '+',
  subtract: '−',
  multiply: '×',
  divide: '÷',
} as const;
export type Operation = (typeof Operation)[keyof typeof Operation];

/** A place to round to, named and as a power of ten: `{ name: 'hundred', exponent: 2 }`. */
export interface RoundingPlace {
  readonly name: string;
  readonly exponent: number;
}

/** A decimal as written, split at the point: 12.50 → `{ whole: '12', decimals: '50' }`; 7 → `{ whole: '7', decimals: '' }`. */
export interface DecimalNumber {
  readonly whole: string;
  readonly decimals: string;
}

/** A clock time or a duration `h:mm`: 3:15 → `{ hours: 3, minutes: 15 }`. */
export interface ClockTime {
  readonly hours: number;
  readonly minutes: number;
}

/**
 * A problem Workback can work. `text` is the problem written the way Workback prints it,
 * e.g. `'304 − 75'`.
 */
export type Problem =
  | { readonly kind: 'addition'; readonly addends: readonly string[]; readonly text: string }
  | {
      readonly kind: 'subtraction';
      readonly minuend: string;
      readonly subtrahend: string;
      readonly text: string;
    }
  | {
      readonly kind: 'multiplication';
      readonly factors: readonly [string, string];
      readonly text: string;
    }
  | {
      readonly kind: 'division';
      readonly dividend: string;
      readonly divisor: string;
      readonly text: string;
    }
  | {
      readonly kind: 'rounding';
      readonly value: string;
      readonly place: RoundingPlace;
      readonly text: string;
    }
  | {
      /** `a op b = result` with exactly one of `a`, `b` left blank (`null`). */
      readonly kind: 'missing';
      readonly op: Operation;
      readonly a: string | null;
      readonly b: string | null;
      readonly result: string;
      readonly text: string;
    }
  | {
      readonly kind: 'fraction-sum';
      readonly op: '+' | '−';
      readonly left: Fraction;
      readonly right: Fraction;
      readonly text: string;
    }
  | {
      readonly kind: 'fraction-comparison';
      readonly left: Fraction;
      readonly right: Fraction;
      readonly text: string;
    }
  | {
      /** Decimals (or money, with `$`) added, subtracted or multiplied: `4.5 + 2.25`, `$12.50 − $3.75`. */
      readonly kind: 'decimal';
      readonly op: '+' | '−' | '×';
      readonly left: DecimalNumber;
      readonly right: DecimalNumber;
      readonly money: boolean;
      readonly text: string;
    }
  | {
      /** Two decimals compared: `0.45 ? 0.5` (answer `<`, `>` or `=`). */
      readonly kind: 'decimal-comparison';
      readonly left: DecimalNumber;
      readonly right: DecimalNumber;
      readonly text: string;
    }
  | {
      /** Clock times or durations added or subtracted: `3:15 − 1:50`. */
      readonly kind: 'clock';
      readonly op: '+' | '−';
      readonly left: ClockTime;
      readonly right: ClockTime;
      readonly text: string;
    };

export type ProblemKind = Problem['kind'];

/** A child's answer as read. */
export type Answer =
  | { readonly kind: 'whole'; readonly value: string; readonly text: string }
  | {
      readonly kind: 'remainder';
      readonly quotient: string;
      readonly remainder: string;
      readonly text: string;
    }
  | {
      /** `whole.decimals`, e.g. 7.3 → `{ whole: '7', decimals: '3' }`. */
      readonly kind: 'decimal';
      readonly whole: string;
      readonly decimals: string;
      readonly text: string;
    }
  | {
      /** A fraction or mixed number: 1 1/4 → `{ whole: 1, numerator: 1, denominator: 4 }`. */
      readonly kind: 'fraction';
      readonly whole: number;
      readonly numerator: number;
      readonly denominator: number;
      readonly text: string;
    }
  | { readonly kind: 'comparison'; readonly sign: '<' | '>' | '='; readonly text: string }
  | {
      /** A time `h:mm` as the child wrote it; the minutes may be 60 or more (1:65). */
      readonly kind: 'clock';
      readonly hours: string;
      readonly minutes: string;
      readonly text: string;
    };

/** What could not be read, in words for a parent; `at` is the character position when known. */
export interface ReadError {
  readonly message: string;
  readonly at?: number;
}

export type ParsedProblem =
  | { readonly ok: true; readonly problem: Problem }
  | { readonly ok: false; readonly error: ReadError };

export type ParsedAnswer =
  | { readonly ok: true; readonly answer: Answer }
  | { readonly ok: false; readonly error: ReadError };
