import { causeMixByWeek } from './causeMixByWeek.js';
import { countRules } from './countRules.js';
import { countSkills } from './countSkills.js';
import { factGaps } from './factGaps.js';
import { findRecurring, type RecurringOptions } from './findRecurring.js';
import { groupDifficulties } from './groupDifficulties.js';
import { rankFindings } from './rankFindings.js';
import type { PatternMiss, Patterns, RightItem } from './types.js';

/**
 * Every pattern of one student's misses at once: cause mix per ISO week, top rules,
 * skills, fact gaps, recurring patterns (with fading since the last plan) and findings
 * across problems (weighed against the items the child got right).
 * `computePatterns(misses, { rightItems, plans, asOf: '2026-04-30' })` →
 * `{ causeMix: […], rules: […], skills: […], facts: { addition, multiplication, list, families }, recurring: […], findings: { rules, groups } }`.
 */
export function computePatterns(
  misses: readonly PatternMiss[],
  options: RecurringOptions & {
    readonly rightItems?: readonly RightItem[];
    readonly from?: string;
    readonly to?: string;
  } = {},
): Patterns {
  const recurring = findRecurring(misses, options);
  const findings = rankFindings(misses, options.rightItems ?? []);
  return {
    causeMix: causeMixByWeek(misses, { from: options.from, to: options.to }),
    rules: countRules(misses),
    skills: countSkills(misses),
    facts: factGaps(misses),
    recurring,
    findings,
    difficulties: groupDifficulties(misses, { findings, recurring }),
  };
}
