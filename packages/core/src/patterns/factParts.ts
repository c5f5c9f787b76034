import type { BasicFact } from './types.js';

/**
 * A fact as the addition or multiplication fact it is or comes from: the two numbers and
 * the grid sign. `factParts({ op: '-', a: 15, b: 8 })` → `[8, 7, '+']`.
 */
export function factParts(fact: BasicFact): [number, number, '+' | 'x'] {
  switch (fact.op) {
    case '+':
      return [fact.a, fact.b, '+'];
    case 'x':
      return [fact.a, fact.b, 'x'];
    case '-':
      return [fact.b, fact.a - fact.b, '+'];
    case '÷':
      return [fact.b, fact.b === 0 ? 0 : Math.floor(fact.a / fact.b), 'x'];
  }
}
