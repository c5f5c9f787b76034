export const TIMES_OF_DAY = ['morning', 'midday', 'afternoon', 'evening'] as const;
export type TimeOfDay = (typeof TIMES_OF_DAY)[number];

export const TIME_OF_DAY_LABEL: Readonly<Record<TimeOfDay, string>> = {
  morning: 'Morning',
  midday: 'Midday',
  afternoon: 'Afternoon',
  evening: 'Evening',
};

export type Score = {
  items: number;
  correct: number;
  marked: number;
  wrong: number;
  percent: number | null;
};

export type Conditions = { rested: boolean | null; afterMeal: boolean | null; note: string | null };

export type SittingSummary = {
  id: number;
  studentId: number;
  answerKeyId: number;
  answerKey: { id: number; title: string; kind: string } | null;
  /** Local clock time, `YYYY-MM-DDTHH:mm`. */
  startedAt: string;
  date: string;
  timeOfDay: TimeOfDay;
  minutes: number | null;
  conditions: Conditions;
  score: Score;
  createdAt: string;
  updatedAt: string;
};

export type SittingMark = {
  id: number;
  keyItemId: number;
  number: number | null;
  correct: boolean;
  answer: string | null;
  missId: number | null;
  /** Wrong on an item whose key answer is flagged: no miss until the key is checked. */
  held?: boolean;
};

export type Sitting = SittingSummary & { marks: SittingMark[] };

export type MissChanges = {
  heldItemIds?: number[];
  createdMissIds: number[];
  reopenedMissIds: number[];
  resolvedMissIds: number[];
  updatedMissIds: number[];
};

export type SavedMarks = Sitting & { misses: MissChanges };

export type SittingPage = {
  items: SittingSummary[];
  total: number;
  page: number;
  pageSize: number;
};

export type SittingInput = {
  studentId: number;
  answerKeyId: number;
  startedAt: string;
  minutes: number | null;
  conditions: Conditions;
};

export type MarkInput = {
  keyItemId: number;
  correct: boolean;
  answer: string | null;
  /** Sent when the checker flags the key's answer and the parent says the key is right. */
  keyAnswerRight?: boolean;
};

/** What the marking grid needs of a key item (the route passes them from the answer key). */
export type MarkableItem = {
  id: number;
  number: number;
  prompt: string;
  answer: string;
  revisitLessons: number[];
  facts: string[];
  /** The checker's look at the key's answer (a flag means: check the key before trusting it). */
  check?: { status: string; expected?: string; message?: string };
};

/** `true` when the checker disagrees with the key's answer, or cannot read it. */
export function keyFlagged(item: Pick<MarkableItem, 'check'>): boolean {
  return item.check?.status === 'disagrees' || item.check?.status === 'unreadable-answer';
}

type Group = {
  sittings: number;
  correct: number;
  marked: number;
  wrong: number;
  percent: number | null;
};

export type SittingsSummary = {
  studentId: number;
  from: string | null;
  to: string | null;
  sittings: number;
  overall: Group;
  overTime: {
    sittingId: number;
    startedAt: string;
    date: string;
    answerKeyId: number;
    title: string;
    kind: string | null;
    timeOfDay: TimeOfDay;
    minutes: number | null;
    conditions: { rested: boolean | null; afterMeal: boolean | null };
    correct: number;
    marked: number;
    wrong: number;
    percent: number | null;
  }[];
  byTimeOfDay: (Group & { timeOfDay: TimeOfDay; from: string; to: string })[];
  byCondition: {
    rested: { yes: Group; no: Group; notNoted: Group };
    afterMeal: { yes: Group; no: Group; notNoted: Group };
  };
  caution: string;
};

/** `'2026-03-02T09:30'` → `'Mon 2 Mar 2026, 09:30'` in the reader's locale (no time zone shift). */
export function formatStartedAt(startedAt: string): string {
  const [date, time = ''] = startedAt.split('T');
  const [y, m, d] = (date ?? '').split('-').map(Number);
  if (!y || !m || !d) return startedAt;
  const day = new Date(y, m - 1, d).toLocaleDateString(undefined, {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
  });
  return time ? `${day}, ${time}` : day;
}

/** `'2026-03-02'` → `'2 Mar'`. */
export function formatShortDate(date: string): string {
  const [y, m, d] = date.split('-').map(Number);
  if (!y || !m || !d) return date;
  return new Date(y, m - 1, d).toLocaleDateString(undefined, { day: 'numeric', month: 'short' });
}

/** `{ correct: 17, marked: 20 }` → `'17 of 20 right'`; nothing marked → `'Not marked yet'`. */
export function scoreText(score: { correct: number; marked: number }): string {
  return score.marked === 0 ? 'Not marked yet' : `${score.correct} of ${score.marked} right`;
}
