import { factFamiliesOf } from './factFamiliesOf.js';
import { factFamilyLabel } from './factFamilyLabel.js';
import { RULE_GROUPS } from './ruleGroups.js';
import { ruleName } from './ruleName.js';
import { byDay } from './seenTally.js';
import type {
  Contradiction,
  Difficulty,
  Findings,
  MissEvidence,
  PatternMiss,
  RecurringPattern,
} from './types.js';

/**
 * One card per difficulty, for a tutor to read at a glance. A rule, the skill its misses
 * are on, and the family of related rules it belongs to are one difficulty, not three:
 * rules of one family (`RULE_GROUPS`) share a card, a recurring rule joins its rule's card,
 * and a recurring skill joins the card holding most of its misses (half or more), else it
 * has its own. Each fact family has its own card. A card is called a `finding` only when
 * one of its rules meets the page's definition (it reproduces 2 or more answers exactly and
 * no right answer goes against it); else `recurring` when it came back 3 or more times in
 * 30 days, else `possible`. Findings first, then recurring, then possible, most misses first.
 * `groupDifficulties(misses, patterns)[0]` →
 * `{ key: 'group:zero-regrouping', title: 'Regrouping across zeros', status: 'finding', count: 4, evidence: [{ problem: '304 − 75', answer: '139', … }], … }`.
 */
export function groupDifficulties(
  misses: readonly PatternMiss[],
  patterns: { readonly findings: Findings; readonly recurring: readonly RecurringPattern[] },
): Difficulty[] {
  const byId = new Map(misses.map((m) => [m.id, m]));
  const cards = new Map<string, Card>();
  const card = (key: string, kind: Difficulty['kind'], title: string): Card => {
    let c = cards.get(key);
    if (!c) {
      c = {
        key,
        kind,
        title,
        ruleIds: [],
        skills: [],
        patternKeys: [],
        missIds: new Set(),
        finding: null,
        recurring: null,
        contradictions: [],
      };
      cards.set(key, c);
    }
    return c;
  };
  const methodKey = (ruleId: string) => {
    const g = RULE_GROUPS.find((x) => x.ruleIds.includes(ruleId));
    return g
      ? { key: `group:${g.group}`, title: g.title }
      : { key: `rule:${ruleId}`, title: ruleName(ruleId) };
  };

  for (const f of patterns.findings.rules) {
    const { key, title } = methodKey(f.ruleId);
    const c = card(key, 'method', title);
    c.ruleIds.push(f.ruleId);
    for (const e of f.evidence) c.missIds.add(e.missId);
    for (const x of f.contradictions)
      if (!c.contradictions.some((o) => o.problem === x.problem && o.occurredOn === x.occurredOn))
        c.contradictions.push(x);
    if (f.status === 'finding' && (c.finding === null || f.explains > c.finding.explains))
      c.finding = { ruleId: f.ruleId, name: ruleName(f.ruleId), explains: f.explains };
  }
  for (const g of patterns.findings.groups) {
    const c = card(`group:${g.group}`, 'method', g.title);
    for (const e of g.evidence) c.missIds.add(e.missId);
  }

  const recurring = [...patterns.recurring].sort(
    (a, b) => (a.kind === 'skill' ? 1 : 0) - (b.kind === 'skill' ? 1 : 0),
  );
  for (const r of recurring) {
    let c: Card;
    if (r.kind === 'rule') {
      const { key, title } = methodKey(r.id);
      c = card(key, 'method', title);
      if (!c.ruleIds.includes(r.id)) c.ruleIds.push(r.id);
    } else if (r.kind === 'fact') {
      c = card(`fact:${r.id}`, 'fact', factFamilyLabel(r.id));
    } else {
      // A skill joins the card that already holds half or more of its misses.
      let best: Card | null = null;
      let shared = 0;
      for (const other of cards.values()) {
        const n = r.missIds.filter((id) => other.missIds.has(id)).length;
        if (n > shared) {
          best = other;
          shared = n;
        }
      }
      c =
        best !== null && shared * 2 >= r.missIds.length
          ? best
          : card(`skill:${r.id}`, 'skill', r.id);
      if (!c.skills.includes(r.id)) c.skills.push(r.id);
    }
    for (const id of r.missIds) c.missIds.add(id);
    c.patternKeys.push(r.key);
    if (c.recurring === null || r.count > c.recurring.count) c.recurring = r;
  }
  // Fact family cards gather every miss with a wrong fact of that family.
  for (const c of cards.values())
    if (c.kind === 'fact')
      for (const m of misses)
        if ((m.diagnosis?.facts ?? []).some((f) => factFamiliesOf(f).includes(c.key.slice(5))))
          c.missIds.add(m.id);
  // The skills a method card's misses are on, in the key's own words.
  for (const c of cards.values())
    if (c.kind === 'method')
      for (const id of c.missIds)
        for (const s of byId.get(id)?.skills ?? []) if (!c.skills.includes(s)) c.skills.push(s);

  const rank = { finding: 0, recurring: 1, possible: 2 } as const;
  return [...cards.values()]
    .map((c): Difficulty => {
      const list = byDay([...c.missIds].flatMap((id) => byId.get(id) ?? [])).reverse();
      const evidence: MissEvidence[] = list.map((m) => ({
        missId: m.id,
        occurredOn: m.occurredOn,
        problem: m.problem,
        answer: m.answer,
      }));
      const status: Difficulty['status'] =
        c.finding !== null ? 'finding' : c.recurring !== null ? 'recurring' : 'possible';
      return {
        key: c.key,
        kind: c.kind,
        title: c.title,
        status,
        sentence: sentenceOf(c, status, evidence.length),
        ruleIds: c.ruleIds,
        skills: c.skills,
        patternKeys: c.patternKeys.length > 0 ? c.patternKeys : c.ruleIds.map((id) => `rule:${id}`),
        count: evidence.length,
        evidence,
        recurring: c.recurring,
        contradictions: c.contradictions,
      };
    })
    .filter((d) => d.count > 0)
    .sort(
      (a, b) =>
        rank[a.status] - rank[b.status] || b.count - a.count || (a.title < b.title ? -1 : 1),
    );
}

interface Card {
  key: string;
  kind: Difficulty['kind'];
  title: string;
  ruleIds: string[];
  skills: string[];
  patternKeys: string[];
  missIds: Set<number>;
  finding: { ruleId: string; name: string; explains: number } | null;
  recurring: RecurringPattern | null;
  contradictions: Contradiction[];
}

function sentenceOf(c: Card, status: Difficulty['status'], count: number): string {
  const misses = count === 1 ? '1 miss' : `${count} misses`;
  if (status === 'finding') {
    const f = c.finding!;
    return `Finding: “${f.name}” reproduces ${f.explains} answers exactly, and no answer the child got right goes against it. ${cap(misses)} in all.`;
  }
  if (status === 'recurring')
    return c.kind === 'method'
      ? `${cap(misses)}. Not called a finding: no one method reproduces 2 or more of these answers with no right answer against it.`
      : c.kind === 'fact'
        ? `${cap(misses)} with a wrong fact in this family.`
        : `${cap(misses)} on this skill.`;
  return c.kind === 'method'
    ? `${cap(misses)} could come from this method; not enough to call it a finding.`
    : `${cap(misses)}.`;
}

const cap = (s: string) => s[0]!.toUpperCase() + s.slice(1);
