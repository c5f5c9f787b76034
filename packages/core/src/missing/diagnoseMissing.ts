import { describeOutcome } from '../diagnose/describeOutcome.js';
import { diagnoseWholeAnswer } from '../diagnose/diagnoseWholeAnswer.js';
import type { Candidate, Findings } from '../diagnose/types.js';
import type { Answer, Problem } from '../parse/types.js';
import type { MissingNumberTrace } from '../trace/types.js';
import { solveMissing } from './solveMissing.js';

type MissingProblem = Extract<Problem, { kind: 'missing' }>;

/**
 * Diagnoses a missing-number equation: the inverse operation that finds the number, and the
 * rules that reproduce the answer.
 * `diagnoseMissing(parse('90 - ? = 35'), whole('125')).matches[0].ids` → `['missing.used-wrong-operation']`.
 */
export function diagnoseMissing(problem: MissingProblem, answer: Answer): Findings {
  const correct = solveMissing(problem) as MissingNumberTrace;
  return diagnoseWholeAnswer(
    { expected: correct.result, expectedTrace: correct },
    answer,
    (written) => searchMissing(problem, correct, written),
    { resultName: 'the missing number' },
  );
}

/** The rules that turn the equation into the written (wrong) answer. */
function searchMissing(
  problem: MissingProblem,
  correct: MissingNumberTrace,
  written: string,
): Candidate[] {
  const outcome = describeOutcome(problem.text, written);
  const matches: Candidate[] = [];
  const wrong = solveMissing(problem, 'wrong-operation');
  if (wrong !== null && wrong.result === written) {
    matches.push({
      ids: ['missing.used-wrong-operation'],
      explanation: `The two numbers shown were worked as ${wrong.inverse.a} ${wrong.inverse.op} ${wrong.inverse.b} = ${wrong.result}; finding the missing number takes ${correct.inverse.a} ${correct.inverse.op} ${correct.inverse.b}, which undoes the ${problem.op} (check: ${correct.check}). ${outcome}`,
      trace: wrong,
      facts: [],
    });
  }
  const shown = [problem.a, problem.b, problem.result].filter((n): n is string => n !== null);
  if (shown.includes(written)) {
    matches.push({
      ids: ['missing.copied-result'],
      explanation: `${written} is already in the problem; the answer repeats it instead of finding the number that makes ${problem.text} true (${correct.check}).`,
      trace: null,
      facts: [],
    });
  }
  return matches;
}
