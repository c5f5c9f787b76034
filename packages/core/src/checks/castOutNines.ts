import type { Answer, Problem } from '../parse/types.js';
import { checkByResidues } from './checkByResidues.js';
import type { CheckResult } from './types.js';

/**
 * Casting out nines: the digit-sum residues of the problem and of the answer must agree.
 * `castOutNines(parse('347 + 589'), whole('936'))` →
 * `{ applies: true, passes: true, problemSide: { working: '5 + 4 = 9 → 0', residue: 0 }, … }`.
 */
export function castOutNines(problem: Problem, answer: Answer): CheckResult {
  return checkByResidues(problem, answer, 9);
}
