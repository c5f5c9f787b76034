/**
 * Where a word problem went wrong, as the parent finds out by asking the child five things in
 * turn: read it to me; what does it ask; how will you work it out; work it; write the answer.
 * The stages follow Newman's error analysis (Newman 1977, "An analysis of sixth-grade pupils'
 * errors on written mathematical tasks"); White (2005) describes the interview in practice.
 * The prompts the parent sees are our own words (packages/web).
 */
export const InterviewStage = {
  reading: 'reading',
  comprehension: 'comprehension',
  transformation: 'transformation',
  process: 'process',
  encoding: 'encoding',
} as const;
export type InterviewStage = (typeof InterviewStage)[keyof typeof InterviewStage];

/** In interview order. */
export const INTERVIEW_STAGES: readonly InterviewStage[] = Object.values(InterviewStage);
