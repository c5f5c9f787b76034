import { revisitLessons, type PlanMiss } from '@workback/core';
import type { MissesService } from '../misses/misses.service.js';
import { toPatternMiss } from '../misses/pattern-miss.js';

export type MissWithDiagnosis = Awaited<ReturnType<MissesService['withDiagnoses']>>[number];

/** A stored miss as the core plan maths reads it: the pattern fields and its lessons. */
export function toPlanMiss(m: MissWithDiagnosis): PlanMiss {
  return {
    ...toPatternMiss(m, m.diagnosis),
    lessons: revisitLessons(m.revisit),
    engineSaysRight: m.correct === true,
    expected: m.expected,
  };
}
