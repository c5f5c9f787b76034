import { diagnoseAddition } from '../addition/diagnoseAddition.js';
import { castOutElevens } from '../checks/castOutElevens.js';
import { castOutNines } from '../checks/castOutNines.js';
import { parseAnswer } from '../parse/parseAnswer.js';
import { parseProblem } from '../parse/parseProblem.js';
import { quoteInput } from '../parse/quoteInput.js';
import type { Answer, Problem } from '../parse/types.js';
import { diagnoseSubtraction } from '../subtraction/diagnoseSubtraction.js';
import { diagnoseMultiplication, layoutOf } from '../multiplication/diagnoseMultiplication.js';
import { diagnoseDivision } from '../division/diagnoseDivision.js';
import { diagnoseRounding } from '../rounding/diagnoseRounding.js';
import { diagnoseMissing } from '../missing/diagnoseMissing.js';
import { diagnoseFractions } from '../fractions/diagnoseFractions.js';
import { diagnoseDecimal } from '../decimals/diagnoseDecimal.js';
import { diagnoseDecimalComparison } from '../decimals/diagnoseDecimalComparison.js';
import { diagnoseClock } from '../time/diagnoseClock.js';
import { groupThousands } from '../numbers/groupThousands.js';
import { adjacentSwap } from './adjacentSwap.js';
import { ENGINE_VERSION } from './engineVersion.js';
import { rankMatches } from './rankMatches.js';
import { suggestCause } from './suggestCause.js';
import type {
  DiagnoseResult,
  Diagnosis,
  Findings,
  WrittenSteps,
  WrittenStepsReport,
} from './types.js';

/**
 * Works the problem, compares the child's answer (and written steps, when given) with the
 * correct working, and lists every error rule that reproduces the answer, best first.
 * Pure and synchronous.
 *
 * `diagnose('304 - 75', '139')` → `{ ok: true, expected: '229', correct: false,
 * rules: [{ id: 'sub.borrow-across-zero', score: 1, explanation: 'In the ones column …' }], … }`;
 * `diagnose('304 $ 75', '1')` → `{ ok: false, part: 'problem', error: { message: 'I could not read “$”.', at: 4 } }`.
 */
export function diagnose(
  problemText: string,
  answerText: string,
  options: { readonly steps?: WrittenSteps } = {},
): DiagnoseResult {
  const parsed = parseProblem(problemText);
  if (!parsed.ok) return { ok: false, part: 'problem', error: parsed.error };
  const read = parseAnswer(answerText);
  if (!read.ok) return { ok: false, part: 'answer', error: read.error };
  const steps = options.steps;
  if (steps !== undefined) {
    const bad = checkSteps(steps) ?? checkStepsFit(steps, parsed.problem);
    if (bad !== null) return { ok: false, part: 'steps', error: { message: bad } };
  }
  const problem = parsed.problem;
  const answer = read.answer;
  const findings = findingsFor(problem, answer, steps);
  // Two neighbouring digits swapped is one careless slip: simpler than a rule and a slip, or
  // two rules, that happen to give the same digits. Only a single rule that writes exactly
  // this answer is still offered.
  const swap =
    !findings.correct && answer.kind === 'whole'
      ? adjacentSwap(findings.expected, answer.value)
      : null;
  const ranked = rankMatches(
    swap === null ? findings.matches : findings.matches.filter((m) => m.ids.length === 1),
  );
  // The closing "Worked that way, … gives …" is said once, on the first explanation. Every
  // sentence writes its numbers with thousands commas (4,455), as a parent writes them.
  const rules = ranked.map(({ facts: _facts, rank: _rank, ...match }, i) => ({
    ...match,
    explanation: groupThousands(
      i === 0 ? match.explanation : match.explanation.replace(CLOSING, ''),
    ),
  }));
  const facts = ranked[0]?.facts ?? [];
  const childRule = ranked.find((m) => m.trace !== null);
  const partial: Omit<Diagnosis, 'suggestedCause'> = {
    ok: true,
    problem,
    expected: findings.expected,
    answer: answer.text,
    parsedAnswer: answer,
    correct: findings.correct,
    firstWrongStep:
      findings.correct || findings.firstWrongStep === null
        ? null
        : { ...findings.firstWrongStep, note: groupThousands(findings.firstWrongStep.note) },
    rules,
    facts,
    checks: { nines: castOutNines(problem, answer), elevens: castOutElevens(problem, answer) },
    trace: {
      expected: findings.expectedTrace,
      child: childRule?.trace == null ? null : { ruleId: childRule.id, working: childRule.trace },
    },
    notes: findings.notes.map(groupThousands),
    writtenSteps: wordsOfSteps(findings.writtenSteps ?? null),
    engineVersion: ENGINE_VERSION,
  };
  const suggested = suggestCause(partial);
  return {
    ...partial,
    suggestedCause:
      suggested === null ? null : { ...suggested, because: groupThousands(suggested.because) },
  };
}

/** The written steps with their findings' words in thousands commas (the digits stay digits). */
function wordsOfSteps(report: WrittenStepsReport | null): WrittenStepsReport | null {
  if (report === null) return null;
  return {
    ...report,
    steps: report.steps.map((s) =>
      s.finding === null
        ? s
        : { ...s, finding: { ...s.finding, explanation: groupThousands(s.finding.explanation) } },
    ),
  };
}

const CLOSING = /\s*Worked that way, .* gives .*\.$/;

function findingsFor(problem: Problem, answer: Answer, steps: WrittenSteps | undefined): Findings {
  switch (problem.kind) {
    case 'addition':
      return diagnoseAddition(problem, answer);
    case 'subtraction':
      return diagnoseSubtraction(problem, answer);
    case 'multiplication':
      return diagnoseMultiplication(problem, answer, steps);
    case 'division':
      return diagnoseDivision(problem, answer, steps);
    case 'rounding':
      return diagnoseRounding(problem, answer);
    case 'missing':
      return diagnoseMissing(problem, answer);
    case 'fraction-sum':
    case 'fraction-comparison':
      return diagnoseFractions(problem, answer);
    case 'decimal':
      return diagnoseDecimal(problem, answer);
    case 'decimal-comparison':
      return diagnoseDecimalComparison(problem, answer);
    case 'clock':
      return diagnoseClock(problem, answer);
  }
}

/** Steps that cannot belong to this problem: more partial products than the multiplier has digits. */
function checkStepsFit(steps: WrittenSteps, problem: Problem): string | null {
  if (steps.partials === undefined || problem.kind !== 'multiplication') return null;
  const { bottom } = layoutOf(problem.factors);
  if (steps.partials.length <= bottom.length) return null;
  return `The written steps have ${steps.partials.length} partial products, but ${bottom} has ${bottom.length} digit${bottom.length === 1 ? '' : 's'}: long multiplication writes one partial product for each digit.`;
}

function checkSteps(steps: WrittenSteps): string | null {
  if (typeof steps !== 'object' || steps === null || Array.isArray(steps)) {
    return 'The written steps should be an object such as { "partials": ["68", "340"] }.';
  }
  for (const key of Object.keys(steps)) {
    if (key !== 'partials' && key !== 'lines')
      return `The written steps have a part ${quoteInput(key)} I do not know; use "partials" or "lines".`;
    const list = (steps as Record<string, unknown>)[key];
    if (!Array.isArray(list))
      return `The written steps ${quoteInput(key)} should be a list of numbers.`;
    for (const item of list) {
      if (typeof item !== 'string' || !/^\d[\d,]*$/.test(item.trim())) {
        const shown = typeof item === 'string' ? item : String(JSON.stringify(item));
        return `In the written steps ${quoteInput(key)}, ${quoteInput(shown)} is not a whole number.`;
      }
    }
  }
  return null;
}
