import type { Candidate, Findings } from '../diagnose/types.js';
import { formatClock } from '../parse/parseMeasured.js';
import type { Answer, ClockTime, Problem } from '../parse/types.js';
import type { ClockTrace } from '../trace/types.js';

type ClockProblem = Extract<Problem, { kind: 'clock' }>;

/** How the minutes are handled: 60 to the hour, 100 to the hour, or never turned into hours. */
export type ClockHabit = 'sixty' | 'hundred-minutes' | 'minutes-not-carried';

const mins = (t: ClockTime): number => t.hours * 60 + t.minutes;
const pad = (n: number): string => String(n).padStart(2, '0');

/**
 * Works a clock problem as a habit does, with its steps in words.
 * `workClock(parse('3:15 - 1:50'), 'sixty').result` → `'1:25'`;
 * with `'hundred-minutes'` → `'1:65'`; `workClock(parse('2:45 + 1:30'), 'minutes-not-carried').result` → `'3:75'`.
 */
export function workClock(problem: ClockProblem, habit: ClockHabit): ClockTrace | null {
  const { left: a, right: b, op } = problem;
  const base = { kind: 'clock' as const, op, left: formatClock(a), right: formatClock(b) };
  if (op === '+') {
    const m = a.minutes + b.minutes;
    if (habit === 'minutes-not-carried') {
      if (m < 60) return null;
      return {
        ...base,
        steps: [
          `${a.minutes} min + ${b.minutes} min = ${m} min, left as ${m}`,
          `${a.hours} h + ${b.hours} h = ${a.hours + b.hours} h`,
        ],
        result: `${a.hours + b.hours}:${pad(m)}`,
      };
    }
    if (habit === 'hundred-minutes') return null;
    const total = mins(a) + mins(b);
    return {
      ...base,
      steps:
        m >= 60
          ? [
              `${a.minutes} min + ${b.minutes} min = ${m} min = 1 h ${m - 60} min`,
              `${a.hours} h + ${b.hours} h + 1 h = ${Math.floor(total / 60)} h`,
            ]
          : [
              `${a.minutes} min + ${b.minutes} min = ${m} min`,
              `${a.hours} h + ${b.hours} h = ${a.hours + b.hours} h`,
            ],
      result: formatClock({ hours: Math.floor(total / 60), minutes: total % 60 }),
    };
  }
  if (habit === 'minutes-not-carried') return null;
  const regroup = a.minutes < b.minutes;
  if (habit === 'hundred-minutes') {
    if (!regroup) return null;
    const worked = a.hours * 100 + a.minutes - (b.hours * 100 + b.minutes);
    return {
      ...base,
      steps: [
        `${a.minutes} min is less than ${b.minutes} min: 1 h taken as 100 min, giving ${a.minutes + 100} min`,
        `${a.minutes + 100} min − ${b.minutes} min = ${a.minutes + 100 - b.minutes} min`,
        `${a.hours - 1} h − ${b.hours} h = ${a.hours - 1 - b.hours} h`,
      ],
      result: `${Math.floor(worked / 100)}:${pad(worked % 100)}`,
    };
  }
  const total = mins(a) - mins(b);
  return {
    ...base,
    steps: regroup
      ? [
          `${a.minutes} min is less than ${b.minutes} min: 1 h taken as 60 min, giving ${a.minutes + 60} min`,
          `${a.minutes + 60} min − ${b.minutes} min = ${a.minutes + 60 - b.minutes} min`,
          `${a.hours - 1} h − ${b.hours} h = ${a.hours - 1 - b.hours} h`,
        ]
      : [
          `${a.minutes} min − ${b.minutes} min = ${a.minutes - b.minutes} min`,
          `${a.hours} h − ${b.hours} h = ${a.hours - b.hours} h`,
        ],
    result: formatClock({ hours: Math.floor(total / 60), minutes: total % 60 }),
  };
}

const RULES = [
  {
    id: 'time.hundred-minutes',
    habit: 'hundred-minutes',
    words: 'An hour was taken as 100 minutes, as when regrouping a hundred.',
  },
  {
    id: 'time.minutes-not-carried',
    habit: 'minutes-not-carried',
    words: 'The minutes came to 60 or more and were not turned into an hour.',
  },
] as const;

/**
 * Diagnoses hours and minutes added or subtracted: the right working (60 minutes to the hour)
 * and the clock habits of the catalog.
 * `diagnoseClock(parse('3:15 - 1:50'), read('1:65')).matches[0].ids` → `['time.hundred-minutes']`.
 */
export function diagnoseClock(problem: ClockProblem, answer: Answer): Findings {
  const right = workClock(problem, 'sixty') as ClockTrace;
  const base = { expected: right.result, expectedTrace: right };
  if (answer.kind !== 'clock')
    return {
      ...base,
      correct: false,
      matches: [],
      firstWrongStep: null,
      notes: [
        `Write a time as hours and minutes, such as 1:25; ${problem.text} is ${right.result}.`,
      ],
    };
  const [hours, minutes] = right.result.split(':').map(Number) as [number, number];
  const wroteHours = Number(answer.hours);
  const wroteMinutes = Number(answer.minutes);
  if (wroteHours === hours && wroteMinutes === minutes)
    return { ...base, correct: true, matches: [], firstWrongStep: null, notes: [] };
  const written = `${wroteHours}:${pad(wroteMinutes)}`;
  const matches: Candidate[] = RULES.flatMap(({ id, habit, words }) => {
    const trace = workClock(problem, habit);
    return trace !== null && trace.result === written
      ? [
          {
            ids: [id],
            explanation: `${words} That gives ${trace.result}; with 60 minutes to the hour, ${problem.text} is ${right.result}.`,
            trace,
            facts: [],
          },
        ]
      : [];
  });
  const minutesDiffer = wroteMinutes !== minutes;
  return {
    ...base,
    correct: false,
    matches,
    firstWrongStep: {
      place: minutesDiffer ? 'minutes' : 'hours',
      expected: minutesDiffer ? pad(minutes) : String(hours),
      written: minutesDiffer ? answer.minutes : answer.hours,
      note:
        wroteMinutes >= 60
          ? `${answer.minutes} minutes is more than an hour; 60 minutes make 1 hour.`
          : minutesDiffer
            ? `The minutes come to ${pad(minutes)}.`
            : `The hours come to ${hours}.`,
    },
    notes: [],
  };
}
