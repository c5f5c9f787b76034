import { describeOutcome } from '../diagnose/describeOutcome.js';
import type { Candidate, Findings } from '../diagnose/types.js';
import type { Answer, Fraction, Problem } from '../parse/types.js';
import type { FractionComparisonTrace, FractionSumTrace } from '../trace/types.js';
import { addFractions } from './addFractions.js';
import { compareFractions } from './compareFractions.js';

type FractionProblem = Extract<Problem, { kind: 'fraction-sum' | 'fraction-comparison' }>;

const show = (f: Fraction): string => `${f.numerator}/${f.denominator}`;

/** The child's answer as an improper fraction, or null when it is not a number. */
function valueOf(answer: Answer): Fraction | null {
  if (answer.kind === 'whole') return { numerator: Number(answer.value), denominator: 1 };
  if (answer.kind === 'fraction')
    return {
      numerator: answer.whole * answer.denominator + answer.numerator,
      denominator: answer.denominator,
    };
  return null;
}

const sameValue = (a: Fraction, b: Fraction): boolean =>
  a.numerator * b.denominator === b.numerator * a.denominator;
const sameForm = (a: Fraction, b: Fraction): boolean =>
  a.numerator === b.numerator && a.denominator === b.denominator;

/**
 * Diagnoses adding, subtracting or comparing two fractions. A right value in another form
 * (6/8 for 3/4, 1 1/4 for 5/4) counts as right, with a note about simplest form.
 * `diagnoseFractions(parse('1/2 + 1/3'), fraction('2/5')).matches[0].ids` → `['frac.add-across']`.
 */
export function diagnoseFractions(problem: FractionProblem, answer: Answer): Findings {
  if (problem.kind === 'fraction-comparison') return diagnoseComparison(problem, answer);
  const correct = addFractions(problem.left, problem.op, problem.right) as FractionSumTrace;
  const expected = correct.result;
  const base = { expected, expectedTrace: correct };
  const value = valueOf(answer);
  if (value === null) {
    return {
      ...base,
      correct: false,
      matches: [],
      firstWrongStep: null,
      notes: [
        `The answer ${answer.text} is not a fraction or whole number; the answer is ${expected}.`,
      ],
    };
  }
  const simplified = correct.simplified;
  if (sameValue(value, simplified)) {
    const notes: string[] = [];
    if (
      answer.kind === 'fraction' &&
      answer.whole === 0 &&
      !sameForm(value, simplified) &&
      simplified.denominator !== 1
    ) {
      notes.push(`${answer.text} is the right amount; in simplest form it is ${expected}.`);
    }
    return { ...base, correct: true, matches: [], firstWrongStep: null, notes };
  }
  const outcome = describeOutcome(problem.text, answer.text);
  const matches: Candidate[] = [];
  // A rule's fraction matches as written or in simplest form.
  const writes = (t: FractionSumTrace | null): t is FractionSumTrace =>
    t !== null &&
    (sameForm(value, t.unsimplified) || sameForm(value, t.simplified)) &&
    !sameValue(t.simplified, simplified);
  const across = addFractions(problem.left, problem.op, problem.right, 'across');
  if (writes(across)) {
    const word = problem.op === '+' ? 'added' : 'subtracted';
    matches.push({
      ids: ['frac.add-across'],
      explanation: `The numerators were ${word} (${problem.left.numerator} ${problem.op} ${problem.right.numerator} = ${across.unsimplified.numerator}) and so were the denominators (${problem.left.denominator} ${problem.op} ${problem.right.denominator} = ${across.unsimplified.denominator}); the parts must first be the same size: over ${correct.commonDenominator}, ${show(correct.leftScaled ?? problem.left)} ${problem.op} ${show(correct.rightScaled ?? problem.right)}. ${outcome}`,
      trace: across,
      facts: [],
    });
  }
  for (const habit of ['numerator-only-left', 'numerator-only-right'] as const) {
    const t = addFractions(problem.left, problem.op, problem.right, habit);
    if (writes(t)) {
      matches.push({
        ids: ['frac.numerator-only'],
        explanation: `The numerators were combined (${problem.left.numerator} ${problem.op} ${problem.right.numerator} = ${t.unsimplified.numerator}) and the denominator ${t.unsimplified.denominator} kept, but ${show(problem.left)} and ${show(problem.right)} have different denominators; over ${correct.commonDenominator} they are ${show(correct.leftScaled ?? problem.left)} and ${show(correct.rightScaled ?? problem.right)}. ${outcome}`,
        trace: t,
        facts: [],
      });
      break;
    }
  }
  const firstWrongStep =
    value.denominator !== simplified.denominator &&
    value.denominator !== correct.unsimplified.denominator
      ? {
          place: 'denominator',
          expected: String(simplified.denominator),
          written: String(value.denominator),
          note: `The parts should be ${correct.commonDenominator}ths (the common denominator of ${problem.left.denominator} and ${problem.right.denominator}); the answer has ${value.denominator}ths.`,
        }
      : {
          place: 'numerator',
          expected: String(
            value.denominator === simplified.denominator
              ? simplified.numerator
              : correct.unsimplified.numerator,
          ),
          written: String(value.numerator),
          note: `Over ${value.denominator} the numerator should be ${value.denominator === simplified.denominator ? simplified.numerator : correct.unsimplified.numerator}; the answer has ${value.numerator}.`,
        };
  return { ...base, correct: false, matches, firstWrongStep, notes: [] };
}

function diagnoseComparison(
  problem: Extract<Problem, { kind: 'fraction-comparison' }>,
  answer: Answer,
): Findings {
  const correct = compareFractions(problem.left, problem.right) as FractionComparisonTrace;
  const expected = correct.sign;
  const base = { expected, expectedTrace: correct };
  if (answer.kind !== 'comparison') {
    return {
      ...base,
      correct: false,
      matches: [],
      firstWrongStep: null,
      notes: [
        `The answer ${answer.text} is not <, > or =; this comparison needs a sign (${expected}).`,
      ],
    };
  }
  if (answer.sign === expected)
    return { ...base, correct: true, matches: [], firstWrongStep: null, notes: [] };
  const matches: Candidate[] = [];
  const byDenominators = compareFractions(problem.left, problem.right, 'denominators');
  if (byDenominators !== null && byDenominators.sign === answer.sign) {
    const [small, large] =
      problem.left.denominator < problem.right.denominator
        ? [problem.left, problem.right]
        : [problem.right, problem.left];
    matches.push({
      ids: ['frac.larger-denominator-larger'],
      explanation: `${show(large)} was taken as larger because ${large.denominator} is larger than ${small.denominator}; with the same numerator, a larger denominator means smaller parts, so ${show(small)} > ${show(large)}.`,
      trace: byDenominators,
      facts: [],
    });
  }
  return {
    ...base,
    correct: false,
    matches,
    firstWrongStep: {
      place: 'sign',
      expected,
      written: answer.sign,
      note: `Over ${correct.commonDenominator}: ${correct.leftScaled.numerator}/${correct.commonDenominator} ${expected} ${correct.rightScaled.numerator}/${correct.commonDenominator}.`,
    },
    notes: [],
  };
}
