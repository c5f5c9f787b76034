import { revisitLessons, type PlanMiss } from '@workback/core';
import type { StudentMissesService } from '../misses/student-misses.service.js';
import { toPatternMiss } from '../misses/pattern-miss.js';

export type MissWithDiagnosis = Awaited<ReturnType<StudentMissesService['withDiagnoses']>>[number];

/**
 * A stored miss as the core plan maths reads it: the pattern fields and its lessons. A word
 * problem the engine cannot read stands on its first wrong line's diagnosis, as it does for
 * patterns, so its rule gets practice problems.
 */
export function toPlanMiss(m: MissWithDiagnosis): PlanMiss {
  const check = m.linesCheck?.ok ? m.linesCheck : null;
  const line =
    check && check.firstWrongLine !== null
      ? (check.lines[check.firstWrongLine - 1]?.diagnosis ?? null)
      : null;
  return {
    ...toPatternMiss(m, m.diagnosis ?? line),
    lessons: revisitLessons(m.revisit),
    engineSaysRight: m.correct === true,
    expected: m.expected,
  };
}
