import type { Answer, Problem } from '../parse/types.js';
import { checkByResidues } from './checkByResidues.js';
import type { CheckResult } from './types.js';

/**
 * The elevens check: alternating digit sums from the ones, taken mod 11, must agree. It
 * catches swapped neighbouring digits that casting out nines misses.
 * `castOutElevens(parse('321 - 235'), whole('68')).passes` → `false`.
 */
export function castOutElevens(problem: Problem, answer: Answer): CheckResult {
  return checkByResidues(problem, answer, 11);
}
