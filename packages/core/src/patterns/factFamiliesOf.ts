import { factParts } from './factParts.js';
import type { BasicFact } from './types.js';

/**
 * The fact families a basic fact belongs to. Multiplication and division share families
 * by factor (`x7`: the × and ÷ facts with 7), addition and subtraction by addend (`+8`);
 * a subtraction or division fact belongs to the families of its addition or
 * multiplication fact. A fact with two equal numbers has one family.
 * `factFamiliesOf({ op: '-', a: 15, b: 8 })` → `['+7', '+8']` (15 − 8 = 7 is 8 + 7).
 */
export function factFamiliesOf(fact: BasicFact): string[] {
  const [x, y, sign] = factParts(fact);
  return [...new Set([x, y].sort((p, q) => p - q).map((n) => `${sign}${n}`))];
}
