import { factFamiliesOf } from '../patterns/factFamiliesOf.js';
import { factFamilyLabel } from '../patterns/factFamilyLabel.js';
import { RULE_GROUPS } from '../patterns/ruleGroups.js';
import { ruleName } from '../patterns/ruleName.js';
import { ruleInfo } from '../rules/catalog.js';
import type { FocusProblem, PlanMiss } from './types.js';

/**
 * The difficulty a miss shows, as one key and a name: its best systematic rule (a rule of
 * a related family counts as the family), else the family of its first wrong fact, else
 * its first skill, else its cause.
 * `difficultyOf(missOf('304 − 75', '139'))` → `{ key: 'group:zero-regrouping', name: 'Regrouping across zeros' }`.
 */
export function difficultyOf(m: PlanMiss): { key: string; name: string } {
  for (const id of m.diagnosis?.rules[0]?.ids ?? []) {
    if (ruleInfo(id)?.kind !== 'systematic') continue;
    const group = RULE_GROUPS.find((g) => g.ruleIds.includes(id));
    return group
      ? { key: `group:${group.group}`, name: group.title }
      : { key: `rule:${id}`, name: ruleName(id) };
  }
  const fact = m.diagnosis?.facts[0];
  if (fact) {
    const family = factFamiliesOf(fact).at(-1)!;
    return { key: `fact:${family}`, name: factFamilyLabel(family) };
  }
  const skill = m.skills[0];
  if (skill) return { key: `skill:${skill}`, name: skill };
  return { key: `cause:${m.cause}`, name: `${m.cause} misses` };
}

/**
 * The 3–5 problems most worth re-working, chosen by recurrence: the difficulties shared by
 * most of the plan's misses first, one problem each (the latest), then more of the busiest
 * difficulties until there are three. Fewer misses than three: all of them.
 * `chooseFocus(misses).map((f) => f.problem)` → `['304 − 75', '7 × 8', …]`.
 */
export function chooseFocus(
  misses: readonly PlanMiss[],
  options: { most?: number } = {},
): FocusProblem[] {
  const most = Math.min(Math.max(options.most ?? 5, 3), 5);
  const byKey = new Map<string, { name: string; list: PlanMiss[] }>();
  for (const m of misses) {
    const d = difficultyOf(m);
    const had = byKey.get(d.key) ?? { name: d.name, list: [] };
    had.list.push(m);
    byKey.set(d.key, had);
  }
  const latestFirst = (a: PlanMiss, b: PlanMiss) =>
    a.occurredOn < b.occurredOn ? 1 : a.occurredOn > b.occurredOn ? -1 : b.id - a.id;
  const groups = [...byKey.values()]
    .map((g) => ({ ...g, list: [...g.list].sort(latestFirst) }))
    .sort(
      (a, b) =>
        b.list.length - a.list.length ||
        latestFirst(a.list[0]!, b.list[0]!) ||
        (a.name < b.name ? -1 : 1),
    );
  const chosen: { m: PlanMiss; name: string; recurs: number }[] = [];
  for (const g of groups)
    if (chosen.length < most) chosen.push({ m: g.list[0]!, name: g.name, recurs: g.list.length });
  for (let round = 1; chosen.length < Math.min(3, misses.length); round += 1)
    for (const g of groups)
      if (chosen.length < 3 && g.list[round])
        chosen.push({ m: g.list[round]!, name: g.name, recurs: g.list.length });
  return chosen.map(({ m, name, recurs }) => ({
    missId: m.id,
    problem: m.problem,
    answer: m.answer,
    expected: m.expected ?? null,
    occurredOn: m.occurredOn,
    recurs,
    reason:
      recurs === 1
        ? `Seen once on this plan: ${lowerFirst(name)}.`
        : `The same difficulty as ${recurs - 1} other ${recurs === 2 ? 'problem' : 'problems'} on this plan: ${lowerFirst(name)}.`,
  }));
}

function lowerFirst(text: string): string {
  return /^[A-Z][a-z]/.test(text) ? text[0]!.toLowerCase() + text.slice(1) : text;
}
