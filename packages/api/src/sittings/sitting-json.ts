import { checkItem } from '../answer-keys/cross-check.js';
import type { Sitting } from './models/sitting.model.js';

export interface Tally {
  correct: number;
  marked: number;
}

/** Whether the checker disagrees with (or cannot read) the key's answer to this item. */
export function keyFlagged(item: { number: number; prompt: string; answer: string }): boolean {
  const status = checkItem(item).status;
  return status === 'disagrees' || status === 'unreadable-answer';
}

export function tallyOf(marks: readonly { correct: boolean }[]): Tally {
  return { correct: marks.filter((m) => m.correct).length, marked: marks.length };
}

export function sumTallies(list: readonly Tally[]): Tally {
  return list.reduce((a, t) => ({ correct: a.correct + t.correct, marked: a.marked + t.marked }), {
    correct: 0,
    marked: 0,
  });
}

/** `{ correct, marked, wrong, percent }`; percent is of the items marked, null when none are. */
export function scoreOf(t: Tally) {
  return {
    correct: t.correct,
    marked: t.marked,
    wrong: t.marked - t.correct,
    percent: t.marked === 0 ? null : Math.round((100 * t.correct) / t.marked),
  };
}

export function toSittingSummary(s: Sitting, tally: Tally | undefined, items: number) {
  return {
    id: s.id,
    studentId: s.studentId,
    answerKeyId: s.answerKeyId,
    answerKey: s.answerKey
      ? { id: s.answerKey.id, title: s.answerKey.title, kind: s.answerKey.kind }
      : null,
    startedAt: s.startedAt,
    date: s.startedAt.slice(0, 10),
    timeOfDay: s.timeOfDay,
    minutes: s.minutes,
    conditions: { rested: s.rested, afterMeal: s.afterMeal, note: s.note },
    score: { items, ...scoreOf(tally ?? { correct: 0, marked: 0 }) },
    createdAt: s.createdAt,
    updatedAt: s.updatedAt,
  };
}
