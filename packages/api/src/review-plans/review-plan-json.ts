import { formatTrace, lineVerdict, ruleName } from '@workback/core';
import type { ReviewPlan } from './models/review-plan.model.js';
import type { MissWithDiagnosis } from './plan-miss.js';

export const SAME_DAY_WARNING =
  'The review falls on the same day as work it reviews; review works better on a calmer, separate day.';

export function toPlanSummary(
  p: Pick<
    ReviewPlan,
    | 'id'
    | 'studentId'
    | 'scheduledFor'
    | 'status'
    | 'lessonsText'
    | 'createdBy'
    | 'createdAt'
    | 'updatedAt'
  >,
) {
  return {
    id: p.id,
    studentId: p.studentId,
    scheduledFor: p.scheduledFor,
    status: p.status,
    lessonsText: p.lessonsText,
    createdBy: p.createdBy,
    createdAt: p.createdAt,
    updatedAt: p.updatedAt,
  };
}

/** A miss on a plan, with its working drawn as plain lines for print. */
export function toPlanMissJson(m: MissWithDiagnosis) {
  const d = m.diagnosis;
  return {
    id: m.id,
    occurredOn: m.occurredOn,
    problem: m.problem,
    answer: m.answer,
    expected: m.expected,
    explanation: m.explanation,
    cause: m.cause,
    status: m.status,
    ruleIds: m.ruleIds,
    firstWrongStep: d?.firstWrongStep ?? null,
    ruleExplanation: d?.rules[0]?.explanation ?? null,
    ruleName: d?.rules[0] ? ruleName(d.rules[0].id) : null,
    steps: m.steps,
    ...planLines(m),
    writtenSteps: d?.writtenSteps ?? null,
    trace: d ? { expected: d.trace.expected, child: d.trace.child?.working ?? null } : null,
    working: d
      ? {
          expected: formatTrace(d.trace.expected),
          child: d.trace.child ? formatTrace(d.trace.child.working) : null,
        }
      : null,
  };
}

/**
 * A word problem's number sentences as the plan shows, prints and exports them: each line with
 * its verdict (`lineVerdict`), the first wrong line, and the interview stage. Lines saved
 * without a check (the engine failed) are listed as written, without verdicts.
 */
function planLines(m: MissWithDiagnosis) {
  const check = m.linesCheck?.ok ? m.linesCheck : null;
  const lines = check
    ? check.lines.map((l) => ({
        line: l.line,
        text: l.text,
        ok: l.ok as boolean | null,
        written: l.written,
        expected: l.expected as string | null,
        followsFrom: l.followsFrom,
        verdict: lineVerdict(l, check.firstWrongLine) as string | null,
      }))
    : (m.lines ?? []).map((text, i) => ({
        line: i + 1,
        text,
        ok: null,
        written: '',
        expected: null,
        followsFrom: null,
        verdict: null,
      }));
  return {
    lines: lines.length > 0 ? lines : null,
    firstWrongLine: check?.firstWrongLine ?? null,
    stage: m.stage,
  };
}

export function sameDayWarning(scheduledFor: string, misses: readonly { occurredOn: string }[]) {
  const dates = [...new Set(misses.map((m) => m.occurredOn))].filter((d) => d === scheduledFor);
  return dates.length === 0
    ? null
    : { code: 'same-day' as const, message: SAME_DAY_WARNING, dates };
}
