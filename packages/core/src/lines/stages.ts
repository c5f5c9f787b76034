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

/**
 * What the parent asks at each stage and what the stage is called, in our own words (after
 * Newman 1977; White 2005): `INTERVIEW_STAGE_GUIDE.process` → `{ prompt: 'Work it', stage:
 * 'Doing the arithmetic' }`. The log form, the miss page and the plan's print and export use them.
 */
export const INTERVIEW_STAGE_GUIDE: Readonly<
  Record<InterviewStage, { readonly prompt: string; readonly stage: string }>
> = {
  reading: { prompt: 'Read it to me', stage: 'Reading the words' },
  comprehension: { prompt: 'What is it asking?', stage: 'Understanding the question' },
  transformation: { prompt: 'How will you work it out?', stage: 'Choosing the operations' },
  process: { prompt: 'Work it', stage: 'Doing the arithmetic' },
  encoding: { prompt: 'Write the answer', stage: 'Writing the answer down' },
};
