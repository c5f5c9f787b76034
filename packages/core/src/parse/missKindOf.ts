import type { MissKind } from '../domain/missKinds.js';
import { parseProblem } from './parseProblem.js';

/**
 * The notebook's kind of a miss: `word` when the child's number sentences or an interview stage
 * were recorded, else the family of the problem as the engine reads it (`other` when it cannot).
 * `missKindOf('$12.50 - $3.75')` → `'money'`; `missKindOf('Pencils…', { lines: ['4 x 15 = 60'] })` → `'word'`.
 */
export function missKindOf(
  problem: string,
  options: { readonly lines?: readonly string[] | null; readonly stage?: string | null } = {},
): MissKind {
  if ((options.lines?.length ?? 0) > 0 || (options.stage ?? null) !== null) return 'word';
  const parsed = parseProblem(problem);
  if (!parsed.ok) return 'other';
  switch (parsed.problem.kind) {
    case 'fraction-sum':
    case 'fraction-comparison':
      return 'fraction';
    case 'decimal':
      return parsed.problem.money ? 'money' : 'decimal';
    case 'decimal-comparison':
      return 'decimal';
    case 'clock':
      return 'time';
    default:
      return 'whole';
  }
}
