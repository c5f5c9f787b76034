import type { Cause, Difficulty, Patterns, RecurringPattern } from '@workback/core';

export type PatternNote = {
  id: number;
  studentId: number;
  patternKey: string;
  body: string;
  author: { id: number; displayName: string } | null;
  createdAt: string;
};

/** `GET /patterns`: the engine's patterns of one student over a day range, with notes. */
/** What the latest check-up on a difficulty's rules said (`GET /patterns` adds it to each card). */
export type CheckUpSummary = {
  id: number;
  createdAt: string;
  status: 'not taken' | 'confirmed' | 'open';
  /** The working the answers fit when confirmed (`'correct'` for the usual working). */
  fits: string | null;
  ruledOut: string[];
  sentence: string | null;
};

export type PatternsResult = Omit<Patterns, 'recurring' | 'difficulties'> & {
  difficulties: (Difficulty & { notes: PatternNote[]; checkUp: CheckUpSummary | null })[];
  studentId: number;
  from: string | null;
  to: string | null;
  missCount: number;
  rightItemCount: number;
  recurring: (RecurringPattern & { notes: PatternNote[] })[];
  notes: PatternNote[];
  caution: string;
};

export type PatternsFilters = { studentId: number; from?: string; to?: string };

/** The household's children as this page needs them (the route passes them in). */
export type StudentRef = { id: number; name: string };

/**
 * Soft colours for the causes in charts: calm, distinguishable, never an alarm red. Each passes
 * 3:1 against the paper as a graphic (WCAG 1.4.11).
 */
export const CAUSE_COLOUR: Readonly<Record<Cause, string>> = {
  slip: '#6b7f9e',
  fact: '#a87a1e',
  concept: '#5a68b0',
  step: '#1c6e62',
  reading: '#8f5a82',
  copying: '#5f7f3f',
  unsure: '#7d7366',
};

/** `'2026-03-04'` → `'4 Mar'` (in the reader's locale; the year when it is not this one). */
export function shortDay(day: string, today = new Date()): string {
  const date = new Date(`${day}T12:00:00`);
  if (Number.isNaN(date.getTime())) return day;
  return date.toLocaleDateString(undefined, {
    day: 'numeric',
    month: 'short',
    ...(date.getFullYear() === today.getFullYear() ? {} : { year: 'numeric' }),
  });
}

const DAY_MS = 86_400_000;

/** `weeksBetween('2026-03-02', '2026-03-20')` → `3` (counting part weeks, at least 1). */
export function weeksBetween(from: string, to: string): number {
  const days = (Date.parse(`${to}T12:00:00Z`) - Date.parse(`${from}T12:00:00Z`)) / DAY_MS;
  return Number.isFinite(days) ? Math.max(1, Math.ceil((days + 1) / 7)) : 1;
}

type SentenceInput = Pick<
  RecurringPattern,
  'kind' | 'id' | 'label' | 'count' | 'firstSeen' | 'lastSeen' | 'status' | 'sincePlan'
>;

/**
 * One plain sentence for a parent: `'Wren keeps making the same step error, “Zeros skipped when
 * regrouping”: seen 13 times in 4 weeks; seen 2 times since the review on 8 Nov.'`
 */
export function recurringSentence(name: string, p: SentenceInput): string {
  const what =
    p.kind === 'rule'
      ? `keeps making the same step error, “${p.label}”`
      : p.kind === 'fact'
        ? `keeps missing ${p.label.replace(/\s*\(.*\)$/, '')}`
        : `keeps missing problems on “${p.id}”`;
  const times = p.count === 1 ? 'once' : `${p.count} times`;
  const weeks = weeksBetween(p.firstSeen, p.lastSeen);
  const span = `${weeks} ${weeks === 1 ? 'week' : 'weeks'}`;
  let since = 'no review plan has covered it yet';
  if (p.sincePlan) {
    const day = shortDay(p.sincePlan.scheduledFor);
    const again = p.sincePlan.seenAgain;
    since =
      again === 0
        ? `not seen since the review on ${day}`
        : `seen ${again === 1 ? 'once' : `${again} times`} since the review on ${day}`;
  }
  return `${name} ${what}: seen ${times} in ${span}; ${since}.`;
}
