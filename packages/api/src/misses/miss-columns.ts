import {
  suggestStageCause,
  type CheckedLines,
  type Diagnosis,
  type InterviewStage,
} from '@workback/core';
import type { Checked } from '../diagnose/diagnose.service.js';

/** A word problem's number sentences, what checkLines made of them, and the interview stage. */
export interface WordProblem {
  lines: string[] | null;
  linesCheck: CheckedLines | null;
  stage: InterviewStage | null;
}

/** The diagnosis columns of a miss row, from what the engine found (or why it could not). */
export function diagnosisColumns(checked: Checked) {
  if (!checked.checked) {
    return {
      engineVersion: null,
      notCheckedReason: checked.reason,
      expected: null,
      correct: null,
      ruleIds: [],
      facts: [],
      suggestedCause: null,
    };
  }
  const d = checked.diagnosis;
  return {
    engineVersion: d.engineVersion,
    notCheckedReason: null,
    expected: d.expected,
    correct: d.correct,
    ruleIds: d.rules.map((r) => r.id),
    facts: d.facts,
    suggestedCause: d.suggestedCause?.cause ?? null,
  };
}

/** The diagnosis of a word problem's first wrong line, or null when every line is right. */
export function firstWrongLine(check: CheckedLines | null): Diagnosis | null {
  if (!check?.ok || check.firstWrongLine === null) return null;
  return check.lines[check.firstWrongLine - 1]?.diagnosis ?? null;
}

/**
 * A word problem's columns. When the engine cannot read the problem itself, its first wrong
 * line's rules and facts stand for the miss (so patterns count them). The interview stage
 * feeds the suggested cause (after Newman 1977; White 2005 for the practice): reading →
 * reading, process → the working's own cause (the first wrong line's for a word problem),
 * encoding → copying, comprehension and transformation → concept.
 */
export function wordProblemColumns(checked: Checked, word: WordProblem) {
  const line = checked.checked ? null : firstWrongLine(word.linesCheck);
  const working = checked.checked ? checked.diagnosis : line;
  const ownCause = working?.suggestedCause?.cause ?? null;
  return {
    lines: word.lines,
    linesCheck: word.linesCheck,
    stage: word.stage,
    ...(line ? { ruleIds: line.rules.map((r) => r.id), facts: line.facts } : {}),
    suggestedCause: word.stage
      ? (suggestStageCause(word.stage, working?.suggestedCause ?? null)?.cause ?? null)
      : ownCause,
  };
}

/** Every rule id a diagnosis names, each id of a pair included. */
export function ruleIdsOf(d: Diagnosis): string[] {
  return dedupe(d.rules.flatMap((r) => [...r.ids]));
}

export function dedupe(list: readonly string[]): string[] {
  return [...new Set(list)];
}
