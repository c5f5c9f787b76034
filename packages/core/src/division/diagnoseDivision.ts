import { describeOutcome } from '../diagnose/describeOutcome.js';
import type { Candidate, Findings, FirstWrongStep, WrittenSteps } from '../diagnose/types.js';
import { placeName } from '../numbers/digits.js';
import type { Answer, Problem } from '../parse/types.js';
import type { DivisionStep, LongDivisionTrace } from '../trace/types.js';
import { checkLines } from './checkLines.js';
import { divideDigitByDigit } from './divideDigitByDigit.js';
import { divideLong, type DivisionRun } from './divideLong.js';

type DivisionProblem = Extract<Problem, { kind: 'division' }>;

/** The answer as Workback writes it: `'7 R 3'`, `'102'`, `'7.3'`; null for other kinds. */
function canonical(answer: Answer): string | null {
  if (answer.kind === 'whole') return answer.value;
  if (answer.kind === 'remainder')
    return answer.remainder === '0' ? answer.quotient : `${answer.quotient} R ${answer.remainder}`;
  if (answer.kind === 'decimal') return `${answer.whole}.${answer.decimals}`;
  return null;
}

/** The numbers written under the dividend, in order: each step's product and difference. */
const linesOf = (trace: LongDivisionTrace): string[] =>
  trace.steps.flatMap((s) => [String(s.product), String(s.difference)]);

const linesAgree = (trace: LongDivisionTrace, lines: readonly string[] | undefined): boolean => {
  if (lines === undefined) return true;
  const mine = linesOf(trace);
  return (
    mine.length === lines.length &&
    mine.every((l, i) => l === (lines[i] as string).replace(/,/g, '').replace(/^0+(?=\d)/, ''))
  );
};

/**
 * Diagnoses a long division (answers `q`, `q R r`, or a decimal): the correct working, every
 * rule that reproduces the answer, and the first quotient digit (or the remainder) that differs.
 * `diagnoseDivision(parse('612 ÷ 6'), whole('12')).matches[0].ids` → `['div.quotient-zero-omitted']`.
 */
export function diagnoseDivision(
  problem: DivisionProblem,
  answer: Answer,
  steps: WrittenSteps | undefined,
): Findings {
  const { dividend, divisor } = problem;
  const correct = divideLong(dividend, divisor) as DivisionRun;
  const expected = correct.result;
  const writtenSteps = steps?.lines === undefined ? null : checkLines(correct.trace, steps.lines);
  const base = { expected, expectedTrace: correct.trace, writtenSteps };
  const written = canonical(answer);
  if (written === null) {
    return {
      ...base,
      correct: false,
      matches: [],
      firstWrongStep: null,
      notes: [`The answer ${answer.text} is not a quotient; this division gives ${expected}.`],
    };
  }
  const notes: string[] = [];
  if (answer.kind === 'decimal') {
    const scaled = BigInt(answer.whole + answer.decimals) * BigInt(divisor);
    if (scaled === BigInt(dividend) * 10n ** BigInt(answer.decimals.length)) {
      notes.push(
        `${answer.text} is the exact value of ${problem.text}, written as a decimal; with a remainder it is ${expected}.`,
      );
      return { ...base, correct: true, matches: [], firstWrongStep: null, notes };
    }
  }
  const lines = steps?.lines;
  if (written === expected)
    return { ...base, correct: true, matches: [], firstWrongStep: null, notes };

  const outcome = describeOutcome(problem.text, written);
  const matches: Candidate[] = [];
  const fits = (
    run: { result: string; trace: LongDivisionTrace } | null,
  ): run is { result: string; trace: LongDivisionTrace } =>
    run !== null &&
    run.result === written &&
    run.result !== expected &&
    linesAgree(run.trace, lines);

  const omitted = divideLong(dividend, divisor, { zeroInQuotient: 'omit' });
  if (omitted !== null && fits(omitted)) {
    const s = omitted.trace.steps[omitted.fired[0] ?? 0] as DivisionStep;
    matches.push({
      ids: ['div.quotient-zero-omitted'],
      explanation: `After bringing down to make ${s.number}, which is smaller than ${divisor}, no 0 was written in the ${s.quotientPlace} place of the quotient, so the other digits moved over. ${outcome}`,
      trace: omitted.trace,
      facts: [],
    });
  }
  if (answer.kind === 'remainder' || answer.kind === 'whole') {
    const q = BigInt(answer.kind === 'remainder' ? answer.quotient : answer.value);
    const short = BigInt(correct.quotient) - q;
    if (short > 0n && short < 10n) {
      const run = divideLong(dividend, divisor, { shortLast: Number(short) });
      if (run !== null && fits(run)) {
        matches.push({
          ids: ['div.remainder-too-large'],
          explanation: `The last step stopped at ${q.toString().slice(-1)} × ${divisor}, leaving ${run.remainder}, which is not smaller than ${divisor}: ${divisor} still fits ${Number(BigInt(run.remainder) / BigInt(divisor))} more time${BigInt(run.remainder) / BigInt(divisor) === 1n ? '' : 's'}. ${outcome}`,
          trace: run.trace,
          facts: [],
        });
      }
    }
  }
  if (correct.remainder !== '0' && written === `${correct.quotient}.${correct.remainder}`) {
    matches.push({
      ids: ['div.remainder-as-decimal'],
      explanation: `The quotient ${correct.quotient} and remainder ${correct.remainder} are right, but they were written as the decimal ${written}; ${correct.quotient} R ${correct.remainder} is ${correct.quotient} and ${correct.remainder}/${divisor}, not ${written}.`,
      trace: { ...correct.trace, result: written },
      facts: [],
    });
  }
  const each = divideDigitByDigit(dividend, divisor);
  if (each !== null && each.dropped.length > 0 && fits(each)) {
    const s = each.trace.steps[each.dropped[0] ?? 0] as DivisionStep;
    matches.push({
      ids: ['div.remainders-dropped'],
      explanation: `Each digit was divided on its own: ${s.number} ÷ ${divisor} = ${s.quotientDigit} with ${s.difference} left over, and that ${s.difference} was dropped instead of being carried into the next digit to make ${s.difference}${s.broughtDown ?? ''}. ${outcome}`,
      trace: each.trace,
      facts: [],
    });
  }
  for (let k = 0; k < correct.trace.steps.length; k += 1) {
    for (const by of [1, -1]) {
      const run = divideLong(dividend, divisor, { slip: { step: k, by } });
      if (run === null || !fits(run)) continue;
      const s = correct.trace.steps[k] as DivisionStep;
      const q = (s.quotientDigit ?? 0) + by;
      matches.push({
        ids: ['div.fact'],
        explanation: `In the ${s.quotientPlace} place, ${divisor} goes into ${s.number} ${s.quotientDigit} time${s.quotientDigit === 1 ? '' : 's'} (${s.quotientDigit} × ${divisor} = ${s.product}); ${q} was written, as if ${q} × ${divisor} were the nearest multiple (it is ${q * Number(divisor)}). The rest of the working is right.`,
        trace: run.trace,
        facts: [
          {
            op: '÷',
            a: s.number,
            b: Number(divisor),
            expected: s.quotientDigit ?? 0,
            written: q,
            where: `${s.quotientPlace} place of the quotient`,
          },
        ],
      });
    }
  }
  return {
    ...base,
    correct: false,
    matches,
    firstWrongStep: firstWrongStepOf(correct, answer, lines),
    notes,
  };
}

function firstWrongStepOf(
  correct: DivisionRun,
  answer: Answer,
  lines: readonly string[] | undefined,
): FirstWrongStep | null {
  if (lines !== undefined) {
    const mine = linesOf(correct.trace);
    for (let i = 0; i < Math.max(mine.length, lines.length); i += 1) {
      const e = mine[i] ?? '';
      const w = (lines[i] ?? '').replace(/,/g, '').replace(/^0+(?=\d)/, '');
      if (e === w) continue;
      const step = correct.trace.steps[Math.floor(i / 2)];
      const what = i % 2 === 0 ? 'product' : 'difference';
      return {
        place: `step ${Math.floor(i / 2) + 1} ${what}`,
        expected: e,
        written: w,
        note:
          step === undefined
            ? `The written steps go on past the end of the working.`
            : i % 2 === 0
              ? `${step.quotientDigit ?? 0} × ${correct.trace.divisor} = ${step.product}; the written step has ${w || 'nothing'}.`
              : `${step.number} − ${step.product} = ${step.difference}; the written step has ${w || 'nothing'}.`,
      };
    }
  }
  if (answer.kind === 'decimal') {
    return {
      place: 'remainder',
      expected: correct.remainder,
      written: answer.text,
      note: `The working ends with ${correct.result}; the answer is written as the decimal ${answer.text}.`,
    };
  }
  const q =
    answer.kind === 'remainder' ? answer.quotient : answer.kind === 'whole' ? answer.value : '';
  const r = answer.kind === 'remainder' ? answer.remainder : '0';
  const Q = correct.quotient;
  for (let i = 0; i < Math.max(Q.length, q.length); i += 1) {
    const e = Q[i] ?? '';
    const w = q[i] ?? '';
    if (e === w) continue;
    const place = placeName(Q.length - 1 - i);
    return {
      place: e === '' ? 'quotient' : `${place} of the quotient`,
      expected: e,
      written: w,
      note:
        e === ''
          ? `The quotient has more digits than the working gives (${Q}).`
          : `The ${place} digit of the quotient is ${e} in the working; the answer has ${w || 'no digit'} there.`,
    };
  }
  if (r !== correct.remainder) {
    return {
      place: 'remainder',
      expected: correct.remainder,
      written: r,
      note: `The quotient is right; the remainder is ${correct.remainder} in the working and ${r} in the answer.`,
    };
  }
  return null;
}
