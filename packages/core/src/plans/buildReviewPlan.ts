import { factFamiliesOf } from '../patterns/factFamiliesOf.js';
import { factFamilyLabel } from '../patterns/factFamilyLabel.js';
import { factText } from '../patterns/factText.js';
import { patternKeysOf } from '../patterns/patternKeysOf.js';
import { byDay } from '../patterns/seenTally.js';
import type { BasicFact } from '../patterns/types.js';
import { missKindOf } from '../parse/missKindOf.js';
import type { PracticeForm } from '../practice/candidateProblem.js';
import { practiceFor } from '../practice/practiceFor.js';
import { ruleName } from '../patterns/ruleName.js';
import { RULES, ruleInfo } from '../rules/catalog.js';
import { formatLessonRanges } from './formatLessonRanges.js';
import { lessonRanges } from './lessonRanges.js';
import { seedOf } from './seedOf.js';
import { activitiesFor } from './activitiesFor.js';
import { chooseFocus } from './chooseFocus.js';
import type {
  FactFamilyDrill,
  LessonRange,
  PracticeActivity,
  PlanItemDraft,
  PlanMiss,
  PracticeBlock,
  ReviewPlanDraft,
} from './types.js';

export interface ReviewPlanOptions {
  /** The plan's id: practice problems are seeded from it, so they stay the same. */
  readonly planId: number;
  /** Practice problems per rule (default 4, at most 10). */
  readonly practicePerRule?: number;
  /** Lesson titles from the curriculum, by lesson number. */
  readonly lessonTitles?: Readonly<Record<number, string>>;
}

/**
 * A review plan from chosen misses: the lessons to revisit (deduplicated, merged into
 * ranges, in order), fact families to drill with a suggested activity (as few families
 * as cover every wrong fact), fresh practice problems for each systematic rule of the
 * misses' best-ranked matches (seeded from the plan id, answers kept apart), and each
 * miss to re-work together. `items` is the checklist, each line with the misses it covers.
 * `buildReviewPlan([missOf('304 − 75', '139', { lessons: [12, 13] })], { planId: 7 }).lessons.text` → `'12–13'`.
 */
export function buildReviewPlan(
  misses: readonly PlanMiss[],
  options: ReviewPlanOptions,
): ReviewPlanDraft {
  const perRule = Math.min(Math.max(options.practicePerRule ?? 4, 1), 10);
  const notes: string[] = [];
  // An answer the engine works out as right is nothing to re-work: it stays off the plan.
  const leftOut = byDay(misses).filter((m) => m.engineSaysRight === true);
  for (const m of leftOut)
    notes.push(
      `${m.problem} answered ${m.answer} is right by the checker, so it is not on this plan; if the key says otherwise, check the key.`,
    );
  const ordered = byDay(misses).filter((m) => m.engineSaysRight !== true);
  const titles = options.lessonTitles ?? {};
  const ranges: LessonRange[] = lessonRanges(ordered.flatMap((m) => m.lessons)).map((r) => {
    const numbers = Array.from({ length: r.to - r.from + 1 }, (_, i) => r.from + i);
    return {
      ...r,
      label: r.from === r.to ? `Lesson ${r.from}` : `Lessons ${r.from}–${r.to}`,
      lessons: numbers.map((number) => ({ number, title: titles[number] ?? null })),
      missIds: ordered
        .filter((m) => m.lessons.some((n) => n >= r.from && n <= r.to))
        .map((m) => m.id),
    };
  });

  const factFamilies = drillsFor(ordered, options.planId);

  const byRule = new Map<string, PlanMiss[]>();
  for (const m of ordered) {
    for (const id of m.diagnosis?.rules[0]?.ids ?? []) {
      if (ruleInfo(id)?.kind !== 'systematic') continue;
      byRule.set(id, [...(byRule.get(id) ?? []), m]);
    }
  }
  const order = new Map(RULES.map((r, i) => [r.id, i]));
  const practice: PracticeBlock[] = [];
  let number = 0;
  for (const [ruleId, list] of [...byRule].sort(
    (a, b) => b[1].length - a[1].length || (order.get(a[0]) ?? 0) - (order.get(b[0]) ?? 0),
  )) {
    // Practice at the child's level and in the form of their misses: a column rule seen on
    // money is practised on money, its figures counted on both sides of the point.
    const form = formOf(list);
    const operation = ruleInfo(ruleId)?.operation;
    const acrossPoint =
      form !== 'whole' && (operation === 'addition' || operation === 'subtraction');
    const base = Math.min(
      Math.max(...list.map((m) => longestNumber(m.problem, acrossPoint)), 2),
      6,
    );
    let made: PracticeBlock | null = null;
    for (let digits = base; digits <= base + 2 && made === null; digits += 1) {
      const set = practiceFor(ruleId, {
        count: perRule,
        digits,
        seed: seedOf(`plan:${options.planId}:${ruleId}`),
        ...(form === 'whole' ? {} : { form }),
      });
      if (!set.ok) continue;
      made = {
        ruleId,
        title: ruleName(ruleId),
        digits,
        problems: set.problems.map((p) => ({
          number: (number += 1),
          problem: p.problem,
          answer: p.answer,
        })),
        missIds: list.map((m) => m.id),
      };
    }
    if (made === null) notes.push(`No practice problems could be made for ${ruleId}.`);
    else practice.push(made);
  }

  const items: PlanItemDraft[] = [
    ...ranges.map((r) => ({
      kind: 'lesson' as const,
      key: `lesson:${r.from}-${r.to}`,
      title: lessonTitle(r),
      payload: r,
      missIds: r.missIds,
    })),
    ...factFamilies.map((f) => ({
      kind: 'fact-family' as const,
      key: `fact:${f.family}`,
      title: `Drill the ${f.label}: ${f.activity.title.toLowerCase()}`,
      payload: f,
      missIds: f.missIds,
    })),
    ...practice.map((p) => ({
      kind: 'practice' as const,
      key: `practice:${p.ruleId}`,
      // "…: zeros skipped when regrouping"; a name like "N − 0 written as 0" keeps its capital.
      title: `Work ${p.problems.length} fresh problems: ${p.title.replace(/^[A-Z](?=[a-z])/, (c) => c.toLowerCase())}`,
      payload: p,
      missIds: p.missIds,
    })),
    ...ordered.map((m) => ({
      kind: 'miss' as const,
      key: `miss:${m.id}`,
      title: `Re-work ${m.problem} together`,
      payload: { missId: m.id, problem: m.problem, answer: m.answer, occurredOn: m.occurredOn },
      missIds: [m.id],
    })),
  ];

  return {
    lessons: { text: formatLessonRanges(ranges), ranges },
    factFamilies,
    practice,
    items,
    covers: [...new Set(ordered.flatMap((m) => patternKeysOf(m)))].sort(),
    notes,
    summary: {
      lessons: ranges.map(lessonTitle),
      facts: factFamilies.map((f) => `${f.label}: ${f.facts.join(', ')}`),
      focus: chooseFocus(ordered),
    },
    leftOut: leftOut.map((m) => m.id),
  };
}

/**
 * A lesson range as a reader names it, with the curriculum's titles:
 * `'Revisit lesson 12 “Subtracting across zeros”'`, `'Revisit lessons 12–13: “A”, “B”'`.
 */
export function lessonTitle(r: LessonRange): string {
  const named = (r.lessons ?? []).filter((l) => l.title !== null);
  const head = `Revisit ${r.label.toLowerCase()}`;
  if (named.length === 0) return head;
  if (r.from === r.to) return `${head} “${named[0]!.title}”`;
  return `${head}: ${named.map((l) => `${l.number} “${l.title}”`).join(', ')}`;
}

/**
 * As few fact families as cover every wrong fact: greedily the family covering most. Each
 * drill gets an activity written for its own table, varied across the plan's drills (and
 * from one plan to the next by its id), with the other suitable activities beside it.
 */
function drillsFor(misses: readonly PlanMiss[], planId: number): FactFamilyDrill[] {
  const used = new Set<PracticeActivity['id']>();
  const facts = new Map<string, { fact: BasicFact; missIds: number[]; families: string[] }>();
  for (const m of misses) {
    for (const f of m.diagnosis?.facts ?? []) {
      const key = `${f.op} ${f.a} ${f.b}`;
      const had = facts.get(key) ?? { fact: f, missIds: [], families: factFamiliesOf(f) };
      if (!had.missIds.includes(m.id)) had.missIds.push(m.id);
      facts.set(key, had);
    }
  }
  const left = new Set(facts.keys());
  const drills: FactFamilyDrill[] = [];
  while (left.size > 0) {
    const count = new Map<string, string[]>();
    for (const key of left)
      for (const family of facts.get(key)!.families)
        count.set(family, [...(count.get(family) ?? []), key]);
    const [family, keys] = [...count].sort(
      (a, b) =>
        b[1].length - a[1].length ||
        Number(b[0].slice(1)) - Number(a[0].slice(1)) ||
        (a[0] < b[0] ? -1 : 1),
    )[0]!;
    for (const k of keys) left.delete(k);
    const chosen = keys.map((k) => facts.get(k)!);
    const all = activitiesFor(
      family,
      chosen.map((c) => c.fact),
    );
    // The best fit first; the plan id turns the order so the same family gets a new game next time.
    const turned = all.map((_, i) => all[(i + planId) % Math.min(all.length, 2)] ?? all[i]!);
    const order = [...new Set([...turned, ...all])];
    const activity = order.find((a) => !used.has(a.id)) ?? order[0]!;
    used.add(activity.id);
    drills.push({
      family,
      label: factFamilyLabel(family),
      facts: chosen.map((c) => factText(c.fact)),
      activity,
      alternatives: all.filter((a) => a.id !== activity.id),
      missIds: [...new Set(chosen.flatMap((c) => c.missIds))].sort((a, b) => a - b),
    });
  }
  return drills;
}

/** The longest number's figures; with `acrossPoint`, 12.50 counts 4 (else 2 and 2). */
function longestNumber(problem: string, acrossPoint = false): number {
  const numbers = problem.replace(/,/g, '').match(acrossPoint ? /\d+(?:\.\d+)?/g : /\d+/g) ?? [];
  return Math.max(0, ...numbers.map((d) => d.replace('.', '').length));
}

/** Money when every miss of the rule is money, decimals when they are decimals or money. */
function formOf(misses: readonly PlanMiss[]): PracticeForm {
  const kinds = misses.map((m) => missKindOf(m.problem));
  if (kinds.every((k) => k === 'money')) return 'money';
  if (kinds.every((k) => k === 'money' || k === 'decimal')) return 'decimal';
  return 'whole';
}
