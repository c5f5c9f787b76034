import { factParts } from '../patterns/factParts.js';
import type { BasicFact } from '../patterns/types.js';
import { PRACTICE_ACTIVITIES } from './practiceActivities.js';
import type { PracticeActivity } from './types.js';

/**
 * The activity to suggest for drilling a fact family, from its wrong facts: a game for
 * three or more facts (variety keeps it going), skip counting for a times table, hopping
 * through ten for addition facts that cross ten, flash cards otherwise.
 * `suggestActivity('x7', [{ op: 'x', a: 7, b: 8 }]).id` → `'skip-counting'`.
 */
export function suggestActivity(family: string, facts: readonly BasicFact[]): PracticeActivity {
  if (facts.length >= 3) return PRACTICE_ACTIVITIES['timer-game'];
  if (family.startsWith('x')) return PRACTICE_ACTIVITIES['skip-counting'];
  const crossesTen = facts.some((f) => {
    const [a, b] = factParts(f);
    return a < 10 && b < 10 && a + b > 10;
  });
  return PRACTICE_ACTIVITIES[crossesTen ? 'through-ten' : 'flash-cards'];
}
