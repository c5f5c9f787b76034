import { diagnose } from '../diagnose/diagnose.js';
import { ruleName } from './ruleName.js';
import type { Problem } from '../parse/types.js';
import { parseProblem } from '../parse/parseProblem.js';
import { applyRule } from '../rules/applyRule.js';
import { RULES, ruleInfo } from '../rules/catalog.js';
import { isoWeekOf } from './isoWeekOf.js';
import { RULE_GROUPS } from './ruleGroups.js';
import { byDay } from './seenTally.js';
import type {
  Contradiction,
  FindingGroup,
  Findings,
  MissEvidence,
  PatternMiss,
  RightItem,
  RuleFinding,
} from './types.js';

/**
 * Findings across problems. One miss matched by a rule is a hypothesis; this weighs each
 * systematic rule against all of a student's work. A rule *explains* a miss when it
 * reproduces the answer on its own. It is *contradicted* by an item the child got right
 * when running the rule on that item gives only wrong answers (the child would have
 * missed it using the rule). A rule explaining 2 or more misses and never contradicted is
 * a `finding`; the rest stay `possible`. Ranked: findings first, then by
 * explains − contradictions. Related rules (`RULE_GROUPS`) seen in two or more different
 * ISO weeks are also reported together as a group.
 * `rankFindings(wrenMisses, wrenRightItems).rules[0]` →
 * `{ ruleId: 'sub.borrow-across-zero', status: 'finding', explains: 3, contradictions: [], … }`.
 */
export function rankFindings(
  misses: readonly PatternMiss[],
  rightItems: readonly RightItem[] = [],
): Findings {
  const ordered = byDay(misses);
  const singles = new Map<string, PatternMiss[]>();
  const pairs = new Map<string, PatternMiss[]>();
  for (const miss of ordered) {
    for (const match of miss.diagnosis?.rules ?? []) {
      const target = match.ids.length === 1 ? singles : pairs;
      for (const id of match.ids) {
        if (ruleInfo(id)?.kind !== 'systematic') continue;
        const list = target.get(id) ?? [];
        if (!list.includes(miss)) list.push(miss);
        target.set(id, list);
      }
    }
  }
  const items = readItems(rightItems);
  // Sittings repeat their keys' problems, so the same written answer is checked many times.
  const isRight = memo((key: string) => {
    const [text, written] = key.split('\u0000') as [string, string];
    const d = diagnose(text, written);
    return d.ok && d.correct;
  });
  const contradictionsOf = memo((ruleId: string) => contradictions(ruleId, items, isRight));
  const groupOf = (id: string) => RULE_GROUPS.find((g) => g.ruleIds.includes(id))?.group ?? null;
  const order = new Map(RULES.map((r, i) => [r.id, i]));
  const rules: RuleFinding[] = [...new Set([...singles.keys(), ...pairs.keys()])]
    .map((ruleId) => {
      const explained = singles.get(ruleId) ?? [];
      const against = contradictionsOf(ruleId);
      return {
        ruleId,
        title: ruleName(ruleId),
        status: explained.length >= 2 && against.length === 0 ? 'finding' : 'possible',
        explains: explained.length,
        inPairs: (pairs.get(ruleId) ?? []).filter((m) => !explained.includes(m)).length,
        evidence: explained.map(evidenceOf),
        contradictions: against,
        score: explained.length - against.length,
        group: groupOf(ruleId),
      } satisfies RuleFinding;
    })
    .sort(
      (a, b) =>
        Number(b.status === 'finding') - Number(a.status === 'finding') ||
        b.score - a.score ||
        b.explains - a.explains ||
        (order.get(a.ruleId) ?? 1e6) - (order.get(b.ruleId) ?? 1e6),
    );

  const groups: FindingGroup[] = [];
  for (const g of RULE_GROUPS) {
    const seen = g.ruleIds.filter((id) => singles.has(id) || pairs.has(id));
    const shown = ordered.filter((m) =>
      (m.diagnosis?.rules ?? []).some((r) => r.ids.some((id) => seen.includes(id))),
    );
    const weeks = [...new Set(shown.map((m) => isoWeekOf(m.occurredOn).week))];
    if (seen.length < 2 || weeks.length < 2) continue;
    const lists = seen.map((id) => contradictionsOf(id));
    const against = lists[0]!.filter((c) =>
      lists.every((l) => l.some((o) => o.problem === c.problem && o.occurredOn === c.occurredOn)),
    );
    const titles = seen.map(ruleName);
    groups.push({
      group: g.group,
      title: g.title,
      ruleIds: seen,
      weeks,
      evidence: shown.map(evidenceOf),
      contradictions: against,
      status: shown.length >= 2 && against.length === 0 ? 'finding' : 'possible',
      sentence:
        `${g.title}: ${shown.length} misses in ${weeks.length} different weeks, done ${seen.length} different ways ` +
        `(${titles.join('; ')}). These are one difficulty seen from different sides.`,
    });
  }
  return { rules, groups };
}

interface ReadItem {
  readonly item: RightItem;
  readonly problem: Problem;
}

function readItems(rightItems: readonly RightItem[]): ReadItem[] {
  const out: ReadItem[] = [];
  for (const item of rightItems) {
    const parsed = parseProblem(item.problem);
    if (parsed.ok) out.push({ item, problem: parsed.problem });
  }
  return out;
}

function contradictions(
  ruleId: string,
  items: readonly ReadItem[],
  isRight: (textAndWritten: string) => boolean,
): Contradiction[] {
  const out: Contradiction[] = [];
  for (const { item, problem } of items) {
    const writes = applyRule(ruleId, problem);
    if (writes.length === 0) continue;
    const anyRight = writes.some((w) => isRight(`${problem.text}\u0000${w}`));
    if (!anyRight)
      out.push({
        occurredOn: item.occurredOn,
        problem: problem.text,
        answer: item.answer,
        ruleWrites: writes[0]!,
      });
  }
  return out;
}

function evidenceOf(m: PatternMiss): MissEvidence {
  return { missId: m.id, occurredOn: m.occurredOn, problem: m.problem, answer: m.answer };
}

function memo<T>(fn: (key: string) => T): (key: string) => T {
  const cache = new Map<string, T>();
  return (key) => {
    if (!cache.has(key)) cache.set(key, fn(key));
    return cache.get(key)!;
  };
}
