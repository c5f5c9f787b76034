import { RULES, ruleInfo } from '../rules/catalog.js';
import { ruleName } from './ruleName.js';
import { bySeen, seenTally } from './seenTally.js';
import type { PatternMiss, RuleCount } from './types.js';

/**
 * The error rules the misses' diagnoses name (each rule of a pair too), most seen first,
 * with first and last day and the misses. A miss whose diagnosis offers two rules counts
 * for both: these are counts of what the engine found possible, not verdicts.
 * `countRules(misses)[0]` → `{ ruleId: 'sub.borrow-across-zero', title: 'Zeros skipped when regrouping', kind: 'systematic', count: 4, … }`.
 */
export function countRules(misses: readonly PatternMiss[]): RuleCount[] {
  const tally = seenTally(misses, (m) => (m.diagnosis?.rules ?? []).flatMap((r) => r.ids));
  const order = new Map(RULES.map((r, i) => [r.id, i]));
  return [...tally]
    .map(([ruleId, seen]) => {
      const info = ruleInfo(ruleId);
      return {
        ruleId,
        title: ruleName(ruleId),
        kind: info?.kind ?? 'systematic',
        ...seen,
      } satisfies RuleCount;
    })
    .sort(
      (a, b) =>
        bySeen<RuleCount>(() => '')(a, b) ||
        (order.get(a.ruleId) ?? 1e6) - (order.get(b.ruleId) ?? 1e6),
    );
}
