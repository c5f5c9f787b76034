import { ruleInfo } from '../rules/catalog.js';
import { factFamiliesOf } from './factFamiliesOf.js';
import type { PatternMiss } from './types.js';

/**
 * The pattern keys one miss shows: each systematic rule its diagnosis names (each rule of
 * a pair too), each fact family of a wrong fact, each skill. Fact rules (`*.fact`) give no
 * rule key: their facts are counted by family instead. A review plan stores the keys of
 * its misses, so a pattern can later be told faded or not.
 * `patternKeysOf(missOf('304 − 75', '139'))` → `['rule:sub.borrow-across-zero', 'skill:subtraction.regrouping']`.
 */
export function patternKeysOf(miss: Pick<PatternMiss, 'diagnosis' | 'skills'>): string[] {
  const keys = new Set<string>();
  for (const match of miss.diagnosis?.rules ?? [])
    for (const id of match.ids) if (ruleInfo(id)?.kind === 'systematic') keys.add(`rule:${id}`);
  for (const fact of miss.diagnosis?.facts ?? [])
    for (const family of factFamiliesOf(fact)) keys.add(`fact:${family}`);
  for (const skill of miss.skills) keys.add(`skill:${skill}`);
  return [...keys];
}
