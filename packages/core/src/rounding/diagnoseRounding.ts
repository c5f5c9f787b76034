import { describeOutcome } from '../diagnose/describeOutcome.js';
import type { Candidate, Findings } from '../diagnose/types.js';
import { placeName } from '../numbers/digits.js';
import type { Answer, Problem } from '../parse/types.js';
import type { RoundingTrace } from '../trace/types.js';
import { roundToPlace, type RoundingHabit } from './roundToPlace.js';

type RoundingProblem = Extract<Problem, { kind: 'rounding' }>;

/** The rounding rules of the catalog, each a rounding habit. */
export const ROUNDING_RULES: readonly { readonly id: string; readonly habit: RoundingHabit }[] = [
  { id: 'round.truncated', habit: 'truncate' },
  { id: 'round.half-down', habit: 'half-down' },
  { id: 'round.wrong-place', habit: 'wrong-place' },
  { id: 'round.chained', habit: 'chained' },
  { id: 'round.carry-lost', habit: 'carry-lost' },
  { id: 'round.lower-digits-kept', habit: 'keep-lower' },
];

const explain = (trace: RoundingTrace, correct: RoundingTrace): string => {
  if (trace.steps.length > 0) {
    return `${trace.rule} ${trace.value} → ${trace.steps.join(' → ')}; rounding in one step looks only at the ${correct.decidingPlace} digit, ${correct.decidingDigit}.`;
  }
  return trace.rule;
};

/**
 * Diagnoses rounding to a place with the school rule (5 or more rounds up).
 * `diagnoseRounding(parse('round 3456 to nearest hundred'), whole('3400')).matches[0].ids` → `['round.truncated']`.
 */
export function diagnoseRounding(problem: RoundingProblem, answer: Answer): Findings {
  const correct = roundToPlace(problem.value, problem.place.exponent) as RoundingTrace;
  const expected = correct.result;
  const base = { expected, expectedTrace: correct };
  if (answer.kind !== 'whole') {
    return {
      ...base,
      correct: false,
      matches: [],
      firstWrongStep: null,
      notes: [`The answer ${answer.text} is not a whole number; rounded, it is ${expected}.`],
    };
  }
  const written = answer.value;
  if (written === expected)
    return { ...base, correct: true, matches: [], firstWrongStep: null, notes: [] };
  const outcome = describeOutcome(problem.text, written);
  const matches: Candidate[] = [];
  // When the dropped digits are exactly 5 then zeros, truncating and rounding a bare 5 down
  // write the same answer; the more particular habit, half-down, is named first.
  const bareFive = roundToPlace(problem.value, problem.place.exponent, 'half-down') !== null;
  for (const rule of ROUNDING_RULES) {
    const trace = roundToPlace(problem.value, problem.place.exponent, rule.habit);
    if (trace !== null && trace.result === written && trace.result !== expected) {
      matches.push({
        ids: [rule.id],
        explanation: `${explain(trace, correct)} ${outcome}`,
        trace,
        facts: [],
        rank: bareFive && rule.habit === 'truncate' ? 1 : 0,
      });
    }
  }
  // Rounding is read from the left: the first differing digit is the first wrong step.
  const width = Math.max(expected.length, written.length);
  const e = expected.padStart(width, ' ');
  const w = written.padStart(width, ' ');
  let firstWrongStep = null;
  for (let i = 0; i < width; i += 1) {
    if (e[i] === w[i]) continue;
    const place = placeName(width - 1 - i);
    firstWrongStep = {
      place,
      expected: (e[i] ?? ' ').trim(),
      written: (w[i] ?? ' ').trim(),
      note: `In the ${place} place the rounded number has ${(e[i] ?? ' ').trim() || 'no digit'}; the answer has ${(w[i] ?? ' ').trim() || 'no digit'}.`,
    };
    break;
  }
  return { ...base, correct: false, matches, firstWrongStep, notes: [] };
}
