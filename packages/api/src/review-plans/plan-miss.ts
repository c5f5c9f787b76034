import type { PlanMiss } from '@workback/core';
import { revisitLessons } from '../answer-keys/revisit.js';
import type { MissesService } from '../misses/misses.service.js';

export type MissWithDiagnosis = Awaited<ReturnType<MissesService['withDiagnoses']>>[number];

/** A stored miss as the core pattern and plan maths read it. */
export function toPlanMiss(m: MissWithDiagnosis): PlanMiss {
  return {
    id: m.id,
    occurredOn: m.occurredOn,
    cause: m.cause,
    skills: m.skills,
    problem: m.problem,
    answer: m.answer,
    diagnosis: m.diagnosis,
    lessons: revisitLessons(m.revisit),
  };
}
