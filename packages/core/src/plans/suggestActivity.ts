import type { BasicFact } from '../patterns/types.js';
import { activitiesFor } from './activitiesFor.js';
import type { PracticeActivity } from './types.js';

/**
 * The activity to suggest for drilling a fact family, written for its own numbers: a game
 * for three or more facts (variety keeps it going), otherwise the best fit of
 * `activitiesFor` (skip counting for a times table, hopping through ten for addition facts
 * that cross ten, flash cards otherwise).
 * `suggestActivity('x7', [{ op: 'x', a: 7, b: 8 }]).id` → `'skip-counting'`.
 */
export function suggestActivity(family: string, facts: readonly BasicFact[]): PracticeActivity {
  const all = activitiesFor(family, facts);
  if (facts.length >= 3) return all.find((a) => a.id === 'timer-game')!;
  return all.find((a) => a.id !== 'near-doubles') ?? all[0]!;
}
