import { diagnose } from '../diagnose/diagnose.js';
import { divideLong } from '../division/divideLong.js';
import { solveMissing } from '../missing/solveMissing.js';
import type { Problem } from '../parse/types.js';
import { roundToPlace } from '../rounding/roundToPlace.js';

/**
 * The right answer as Workback prints it, worked directly for whole numbers (a full
 * diagnosis also searches every rule, which a check-up's hundreds of candidates need not).
 * `rightAnswerOf(parse('612 ÷ 5'))` → `'122 R 2'`.
 */
export function rightAnswerOf(problem: Problem): string | null {
  switch (problem.kind) {
    case 'addition':
      return problem.addends.reduce((sum, a) => sum + BigInt(a), 0n).toString();
    case 'subtraction': {
      const difference = BigInt(problem.minuend) - BigInt(problem.subtrahend);
      return difference < 0n ? null : difference.toString();
    }
    case 'multiplication':
      return (BigInt(problem.factors[0]) * BigInt(problem.factors[1])).toString();
    case 'division':
      return divideLong(problem.dividend, problem.divisor)?.result ?? null;
    case 'rounding':
      return roundToPlace(problem.value, problem.place.exponent)?.result ?? null;
    case 'missing':
      return solveMissing(problem)?.result ?? null;
    default: {
      const worked = diagnose(problem.text, '0');
      return worked.ok ? worked.expected : null;
    }
  }
}
