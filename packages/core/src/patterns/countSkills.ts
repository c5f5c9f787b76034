import { bySeen, seenTally } from './seenTally.js';
import type { PatternMiss, SkillCount } from './types.js';

/**
 * The skills with the most misses, most first (then the most recent, then by name).
 * `countSkills(misses)[0]` → `{ skill: 'subtraction.regrouping', count: 5, firstSeen: …, lastSeen: …, missIds: […] }`.
 */
export function countSkills(misses: readonly PatternMiss[]): SkillCount[] {
  return [...seenTally(misses, (m) => m.skills)]
    .map(([skill, seen]) => ({ skill, ...seen }))
    .sort(bySeen((s) => s.skill));
}
