import type { BasicFact } from './types.js';

const SIGN = { '+': '+', '-': '−', x: '×', '÷': '÷' } as const;

/** `factText({ op: 'x', a: 7, b: 8 })` → `'7 × 8'`. */
export function factText(fact: BasicFact): string {
  return `${fact.a} ${SIGN[fact.op]} ${fact.b}`;
}
