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
  | { readonly kind: 'comparison'; readonly sign: '<' | '>' | '='; readonly text: string };

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
