import type { PatternMiss, StoredDiagnosis } from '@workback/core';

type PatternFields = Pick<
  PatternMiss,
  'id' | 'occurredOn' | 'cause' | 'skills' | 'problem' | 'answer'
>;

/** A stored miss as the core pattern maths reads it. */
export function toPatternMiss(m: PatternFields, diagnosis: StoredDiagnosis | null): PatternMiss {
  return {
    id: m.id,
    occurredOn: m.occurredOn,
    cause: m.cause,
    skills: m.skills,
    problem: m.problem,
    answer: m.answer,
    diagnosis,
  };
}
