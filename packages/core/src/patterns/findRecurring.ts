import { ruleName } from './ruleName.js';
import { dateOfDay, dayNumber } from './dayNumber.js';
import { factFamiliesOf } from './factFamiliesOf.js';
import { factFamilyLabel } from './factFamilyLabel.js';
import { factText } from './factText.js';
import { patternKeysOf } from './patternKeysOf.js';
import { byDay } from './seenTally.js';
import type {
  PatternKind,
  PatternMiss,
  RecurringPattern,
  ReviewedPlan,
  SincePlan,
} from './types.js';

export interface RecurringOptions {
  /** Review plans of the student, with the pattern keys each covered. */
  readonly plans?: readonly ReviewedPlan[];
  /** Only plans dated on or before this day count as held (the API passes today). */
  readonly asOf?: string;
  /** Length of the window in calendar days, both ends counted (default 30). */
  readonly windowDays?: number;
  /** Misses needed inside one window (default 3). */
  readonly minCount?: number;
}

/**
 * The patterns that recur: a systematic rule, fact family or skill shown by `minCount` or
 * more misses (default 3) within `windowDays` consecutive calendar days (default 30, both
 * ends counted: misses on 1 March and 30 March are 30 days apart in this sense, 1 March
 * and 31 March are 31). For each, whether it has faded since the last review plan that
 * covered it: `faded` when no miss shows it on a day after that plan's day.
 * Most active first: not faded before faded, then by the busiest window.
 * `findRecurring(threeBorrowMissesInMarch)[0]` →
 * `{ key: 'rule:sub.borrow-across-zero', count: 3, status: 'not-reviewed', sentence: '3 misses from 2026-03-02 to 2026-03-20 show “Zeros skipped when regrouping”. No review plan has covered it yet.', … }`.
 */
export function findRecurring(
  misses: readonly PatternMiss[],
  options: RecurringOptions = {},
): RecurringPattern[] {
  const windowDays = options.windowDays ?? 30;
  const minCount = options.minCount ?? 3;
  const plans = (options.plans ?? []).filter(
    (p) => options.asOf === undefined || p.scheduledFor <= options.asOf,
  );
  const byKey = new Map<string, PatternMiss[]>();
  for (const miss of byDay(misses)) {
    for (const key of patternKeysOf(miss)) byKey.set(key, [...(byKey.get(key) ?? []), miss]);
  }
  const out: RecurringPattern[] = [];
  for (const [key, list] of byKey) {
    const window = busiestWindow(list, windowDays);
    if (window.count < minCount) continue;
    const kind = key.slice(0, key.indexOf(':')) as PatternKind;
    const id = key.slice(key.indexOf(':') + 1);
    const plan = lastPlanCovering(plans, key);
    const sincePlan: SincePlan | null =
      plan === undefined
        ? null
        : {
            planId: plan.id,
            scheduledFor: plan.scheduledFor,
            seenAgain: list.filter((m) => m.occurredOn > plan.scheduledFor).length,
            lastSeen:
              list.filter((m) => m.occurredOn > plan.scheduledFor).at(-1)?.occurredOn ?? null,
          };
    const status =
      sincePlan === null ? 'not-reviewed' : sincePlan.seenAgain === 0 ? 'faded' : 'seen-again';
    const label = labelOf(kind, id);
    out.push({
      key,
      kind,
      id,
      label,
      count: list.length,
      firstSeen: list[0]!.occurredOn,
      lastSeen: list.at(-1)!.occurredOn,
      missIds: list.map((m) => m.id),
      window,
      status,
      sincePlan,
      sentence: sentenceOf(kind, id, label, list, window, sincePlan),
    });
  }
  return out.sort(
    (a, b) =>
      Number(a.status === 'faded') - Number(b.status === 'faded') ||
      b.window.count - a.window.count ||
      b.count - a.count ||
      (a.lastSeen === b.lastSeen ? 0 : a.lastSeen > b.lastSeen ? -1 : 1) ||
      (a.key < b.key ? -1 : 1),
  );
}

/** The window of `days` days holding the most misses; the earliest of equals. */
function busiestWindow(
  list: readonly PatternMiss[],
  days: number,
): { from: string; to: string; count: number } {
  const dayOf = list.map((m) => dayNumber(m.occurredOn));
  let best = { from: 0, to: 0, count: 0 };
  let end = 0;
  for (let start = 0; start < dayOf.length; start += 1) {
    if (end < start) end = start;
    while (end + 1 < dayOf.length && dayOf[end + 1]! - dayOf[start]! <= days - 1) end += 1;
    const count = end - start + 1;
    if (count > best.count) best = { from: dayOf[start]!, to: dayOf[end]!, count };
  }
  return { from: dateOfDay(best.from), to: dateOfDay(best.to), count: best.count };
}

function lastPlanCovering(plans: readonly ReviewedPlan[], key: string): ReviewedPlan | undefined {
  let last: ReviewedPlan | undefined;
  for (const p of plans) {
    if (!p.covers.includes(key)) continue;
    if (
      last === undefined ||
      p.scheduledFor > last.scheduledFor ||
      (p.scheduledFor === last.scheduledFor && p.id > last.id)
    )
      last = p;
  }
  return last;
}

function labelOf(kind: PatternKind, id: string): string {
  if (kind === 'rule') return ruleName(id);
  if (kind === 'fact') return factFamilyLabel(id);
  return id;
}

function sentenceOf(
  kind: PatternKind,
  id: string,
  label: string,
  list: readonly PatternMiss[],
  window: { from: string; to: string; count: number },
  since: SincePlan | null,
): string {
  const span = `${window.count} misses from ${window.from} to ${window.to}`;
  let what: string;
  if (kind === 'rule') what = `${span} show “${label}”.`;
  else if (kind === 'skill') what = `${span} were on the skill “${label}”.`;
  else {
    const facts = [
      ...new Set(
        list.flatMap((m) =>
          (m.diagnosis?.facts ?? []).filter((f) => factFamiliesOf(f).includes(id)).map(factText),
        ),
      ),
    ];
    what = `${span} had a wrong fact among the ${label} (${facts.join(', ')}).`;
  }
  if (since === null) return `${what} No review plan has covered it yet.`;
  if (since.seenAgain === 0) return `${what} Not seen since the review of ${since.scheduledFor}.`;
  const times = since.seenAgain === 1 ? 'once' : `${since.seenAgain} times`;
  return `${what} Seen ${times} since the review of ${since.scheduledFor}.`;
}
