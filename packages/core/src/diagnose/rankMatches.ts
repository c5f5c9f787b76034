import { ruleInfo, ruleOrder } from '../rules/catalog.js';
import type { Candidate, RuleMatch } from './types.js';

/** Scores by kind of explanation: one systematic rule, one fact, two systematic rules, a rule and a fact. */
const SCORE = { single: 1, fact: 0.75, pair: 0.5, ruleAndFact: 0.4 } as const;

const isFact = (id: string): boolean => ruleInfo(id)?.kind === 'fact';

function scoreOf(ids: readonly string[]): number {
  if (ids.length === 1) return isFact(ids[0] as string) ? SCORE.fact : SCORE.single;
  return ids.some(isFact) ? SCORE.ruleAndFact : SCORE.pair;
}

/**
 * Ranks candidates best first: single systematic rules, then single fact rules, then pairs
 * (two systematic rules before a rule with a fact slip); ties go by the candidates' own
 * `rank` (e.g. the smaller slip first), then catalog order.
 * Duplicates (the same ids) keep their first explanation.
 * `rankMatches([factCandidate, ruleCandidate])[0].id` → the systematic rule's id.
 */
export function rankMatches(
  candidates: readonly Candidate[],
): (RuleMatch & { facts: Candidate['facts']; rank: number })[] {
  const seen = new Set<string>();
  const out: (RuleMatch & { facts: Candidate['facts']; rank: number })[] = [];
  for (const c of candidates) {
    const id = c.ids.join('+');
    if (seen.has(id)) continue;
    seen.add(id);
    out.push({
      id,
      ids: c.ids,
      score: scoreOf(c.ids),
      explanation: c.explanation,
      trace: c.trace,
      facts: c.facts,
      rank: c.rank ?? 0,
    });
  }
  out.sort((a, b) => {
    if (a.score !== b.score) return b.score - a.score;
    if (a.rank !== b.rank) return a.rank - b.rank;
    for (let k = 0; k < 2; k += 1) {
      const d = ruleOrder(a.ids[k] ?? '') - ruleOrder(b.ids[k] ?? '');
      if (d !== 0) return d;
    }
    return 0;
  });
  return out;
}
