import {
  checkLines,
  suggestStageCause,
  type Cause,
  type Diagnosis,
  type InterviewStage,
  type SuggestedCause,
} from '@workback/core';
import { useMemo } from 'react';

import { readLines } from '../components/word-problem';
import { useDebouncedValue } from './use-debounced-value';
import { LIVE_DELAY_MS } from './use-live-diagnosis';

/** A cause the form offers, with its reason; the parent decides. */
export type CauseSuggestion = { cause: Cause; because: string };

/** The first wrong line's own suggestion, when the sentences can be read. */
function firstWrongLineSuggestion(text: string): SuggestedCause | null {
  const lines = readLines(text);
  if (lines.length === 0 || lines.length > 20) return null;
  try {
    const check = checkLines(lines);
    if (!check.ok || check.firstWrongLine === null) return null;
    return check.lines[check.firstWrongLine - 1]?.diagnosis.suggestedCause ?? null;
  } catch {
    return null;
  }
}

/**
 * The cause to offer as the parent fills the form, as the server will suggest it: the
 * working's own suggestion (the problem's diagnosis, or when the problem cannot be read the
 * first wrong number sentence's), and once an interview stage is chosen the stage's
 * (reading → misread, process → the working's; see `suggestStageCause`).
 */
export function useWordSuggestion(
  diagnosis: Diagnosis | null,
  linesText: string,
  stage: InterviewStage | '' | null,
): CauseSuggestion | null {
  const settled = useDebouncedValue(linesText, LIVE_DELAY_MS);
  return useMemo(() => {
    const working = diagnosis ? diagnosis.suggestedCause : firstWrongLineSuggestion(settled);
    if (!stage) return working;
    return suggestStageCause(stage, working);
  }, [diagnosis, settled, stage]);
}
