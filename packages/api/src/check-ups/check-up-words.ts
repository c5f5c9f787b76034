import { RIGHT_WORKING, ruleName, type CheckUpReading } from '@workback/core';

/** A hypothesis in a parent's words. */
export function hypothesisName(id: string): string {
  return id === RIGHT_WORKING ? 'The usual working (the miss was a one-off slip)' : ruleName(id);
}

/** What an answer written by this hypothesis would mean, for the parent's sheet. */
export function answerMeaning(id: string): string {
  return id === RIGHT_WORKING ? 'right: the usual working' : `the way of working “${ruleName(id)}”`;
}

/** One or two plain sentences on what the answers say; an aid to judgement, never a grade. */
export function readingSentence(reading: CheckUpReading): string {
  if (reading.confirmed === RIGHT_WORKING)
    return 'The answers fit the usual working: the earlier misses look like one-off slips. A quick look back at them together may be all that is needed.';
  if (reading.confirmed !== null)
    return `The answers fit “${ruleName(reading.confirmed)}” and none of the other explanations: it looks like a habit worth re-teaching. You know your child best; take this as one more piece of evidence.`;
  if (reading.open.length === 0)
    return 'The answers fit none of the explanations well. Ask your child to talk through one or two of them: their words will tell you more than the numbers.';
  return `The answers leave more than one explanation open (${reading.open.map(hypothesisName).join('; ')}). Another check-up on a calmer day may settle it.`;
}
