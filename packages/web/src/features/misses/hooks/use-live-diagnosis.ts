import {
  diagnose,
  parseProblem,
  type DiagnoseResult,
  type ParsedProblem,
  type WrittenSteps,
} from '@workback/core';
import { useMemo } from 'react';

import { useDebouncedValue } from './use-debounced-value';

export const LIVE_DELAY_MS = 200;

export type LiveDiagnosis = {
  /** How the problem reads so far (`null` while it is empty). */
  parsed: ParsedProblem | null;
  /** The engine's findings once both problem and answer are there. */
  result: DiagnoseResult | null;
  /** The engine could not work this kind of problem (it threw). */
  failed: boolean;
};

/** `'68, 340'` → `['68', '340']`; blank → `null`. */
export function readPartials(text: string): string[] | null {
  const parts = text
    .split(/[,;\s]+/)
    .map((p) => p.trim())
    .filter(Boolean);
  return parts.length > 0 ? parts : null;
}

/** Runs core's parser and `diagnose()` in the browser as the parent types, lightly debounced. */
export function useLiveDiagnosis(problem: string, answer: string, partials = ''): LiveDiagnosis {
  const settled = useDebouncedValue(
    useMemo(() => ({ problem, answer, partials }), [problem, answer, partials]),
    LIVE_DELAY_MS,
  );
  return useMemo(() => {
    const text = settled.problem.trim();
    if (!text) return { parsed: null, result: null, failed: false };
    const parsed = parseProblem(text);
    const written = settled.answer.trim();
    if (!parsed.ok || !written) return { parsed, result: null, failed: false };
    const list = readPartials(settled.partials);
    const steps: WrittenSteps | undefined = list ? { partials: list } : undefined;
    try {
      return { parsed, result: diagnose(text, written, steps ? { steps } : {}), failed: false };
    } catch {
      return { parsed, result: null, failed: true };
    }
  }, [settled]);
}
