import type { Findings } from '../diagnose/types.js';
import { compareDecimals, formatDecimal } from '../parse/parseMeasured.js';
import type { Answer, DecimalNumber, Problem } from '../parse/types.js';
import type { DecimalComparisonTrace } from '../trace/types.js';

type ComparisonProblem = Extract<Problem, { kind: 'decimal-comparison' }>;
type Sign = '<' | '>' | '=';

const SIGN: Readonly<Record<-1 | 0 | 1, Sign>> = { '-1': '<', 0: '=', 1: '>' };

/** Which habit compares how: by value, or by the length of the decimal part. */
export type ComparisonHabit = 'value' | 'longer-is-larger' | 'shorter-is-larger';

/**
 * Compares two decimals as a habit does. The length habits only change the verdict when the
 * whole parts are equal and the decimal parts differ in length (0.45 ? 0.5).
 * `compareAs(0.45, 0.5, 'longer-is-larger').sign` → `'>'`.
 */
export function compareAs(
  left: DecimalNumber,
  right: DecimalNumber,
  habit: ComparisonHabit,
): DecimalComparisonTrace {
  const places = Math.max(left.decimals.length, right.decimals.length);
  const padded: [string, string] = [
    formatDecimal({ whole: left.whole, decimals: left.decimals.padEnd(places, '0') }),
    formatDecimal({ whole: right.whole, decimals: right.decimals.padEnd(places, '0') }),
  ];
  const byLength =
    habit !== 'value' &&
    left.whole === right.whole &&
    left.decimals.length !== right.decimals.length;
  let sign: Sign;
  let basis: string;
  if (byLength) {
    const longer = left.decimals.length > right.decimals.length ? 1 : -1;
    sign = SIGN[(habit === 'longer-is-larger' ? longer : -longer) as -1 | 1];
    basis =
      habit === 'longer-is-larger'
        ? 'the number with more digits after the point taken as larger'
        : 'the number with fewer digits after the point taken as larger';
  } else {
    sign = SIGN[compareDecimals(left, right)];
    basis = `both written to ${places} place${places === 1 ? '' : 's'} after the point: ${padded[0]} ${sign} ${padded[1]}`;
  }
  return {
    kind: 'decimal-comparison',
    left: formatDecimal(left),
    right: formatDecimal(right),
    padded,
    basis,
    sign,
    result: sign,
  };
}

const HABITS = [
  { id: 'dec.longer-is-larger', habit: 'longer-is-larger' },
  { id: 'dec.shorter-is-larger', habit: 'shorter-is-larger' },
] as const;

/**
 * Diagnoses a decimal comparison: the right sign (both numbers to the same places), and the
 * length habits of the catalog when they give the child's sign.
 * `diagnoseDecimalComparison(parse('0.45 ? 0.5'), read('>')).matches[0].ids` → `['dec.longer-is-larger']`.
 */
export function diagnoseDecimalComparison(problem: ComparisonProblem, answer: Answer): Findings {
  const right = compareAs(problem.left, problem.right, 'value');
  const base = { expected: right.sign, expectedTrace: right };
  if (answer.kind !== 'comparison')
    return {
      ...base,
      correct: false,
      matches: [],
      firstWrongStep: null,
      notes: [`Answer a comparison with <, > or =; ${problem.text} is ${right.sign}.`],
    };
  if (answer.sign === right.sign)
    return { ...base, correct: true, matches: [], firstWrongStep: null, notes: [] };
  const matches = HABITS.flatMap(({ id, habit }) => {
    const trace = compareAs(problem.left, problem.right, habit);
    return trace.sign === answer.sign && trace.sign !== right.sign
      ? [
          {
            ids: [id],
            explanation: `${trace.left} ${trace.sign} ${trace.right}: ${trace.basis}. Written to the same places, ${right.padded[0]} ${right.sign} ${right.padded[1]}.`,
            trace,
            facts: [],
          },
        ]
      : [];
  });
  return {
    ...base,
    correct: false,
    matches,
    firstWrongStep: {
      place: 'sign',
      expected: right.sign,
      written: answer.sign,
      note: `Written to the same places: ${right.padded[0]} ${right.sign} ${right.padded[1]}.`,
    },
    notes: [],
  };
}
