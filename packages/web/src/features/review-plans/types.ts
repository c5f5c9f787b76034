import type {
  Cause,
  FactFamilyDrill,
  FirstWrongStep,
  FocusProblem,
  InterviewStage,
  LessonRange,
  MissStatus,
  PlanItemKind,
  PracticeBlock,
  Role,
  WrittenStepsReport,
} from '@workback/core';

export type PlanProgress = { done: number; total: number };

/** A row of `GET /review-plans`. */
export type PlanSummary = {
  id: number;
  studentId: number;
  scheduledFor: string;
  status: 'open' | 'done';
  lessonsText: string;
  createdBy: number | null;
  createdAt: string;
  updatedAt: string;
  progress: PlanProgress;
  missCount: number;
};

export type PlanMissPayload = {
  missId: number;
  problem: string;
  answer: string;
  occurredOn: string;
};

export type PlanItem = {
  id: number;
  position: number;
  kind: PlanItemKind;
  key: string;
  title: string;
  payload: LessonRange | FactFamilyDrill | PracticeBlock | PlanMissPayload;
  done: boolean;
  doneAt: string | null;
  doneBy: number | null;
  missIds: number[];
};

export type PlanMiss = {
  id: number;
  occurredOn: string;
  problem: string;
  answer: string;
  expected: string | null;
  explanation: string;
  cause: Cause;
  status: MissStatus;
  ruleIds: string[];
  firstWrongStep: FirstWrongStep | null;
  ruleExplanation: string | null;
  working: { expected: string; child: string | null } | null;
  ruleName?: string | null;
  /** The partial products or division lines the child wrote, checked step by step. */
  writtenSteps?: WrittenStepsReport | null;
  /** A word problem's number sentences, each with its verdict (null when none were recorded). */
  lines?: PlanLine[] | null;
  firstWrongLine?: number | null;
  stage?: InterviewStage | null;
};

/** One number sentence on a plan: `verdict` is null when the line could not be checked. */
export type PlanLine = {
  line: number;
  text: string;
  ok: boolean | null;
  written: string;
  expected: string | null;
  followsFrom: number | null;
  verdict: string | null;
};

/** The plan's first page: lessons, facts and the problems most worth re-working. */
export type PlanSummaryJson = {
  lessons: string[];
  facts: string[];
  focus: FocusProblem[];
};

/** `GET /review-plans/:id`: the plan with its checklist and the misses it reviews. */
export type ReviewPlan = Omit<PlanSummary, 'missCount'> & {
  student: { id: number; name: string; gradeLevel: string };
  lessons: { text: string; ranges: LessonRange[] };
  factFamilies: FactFamilyDrill[];
  practice: PracticeBlock[];
  misses: PlanMiss[];
  items: PlanItem[];
  covers: string[];
  notes: string[];
  summary: PlanSummaryJson;
  warning: { code: 'same-day'; message: string; dates: string[] } | null;
};

export type PlanInput = { studentId: number; scheduledFor: string; missIds?: number[] };

/** A miss the plan builder offers (a row of `GET /misses`, the fields it needs). */
export type OpenMiss = {
  id: number;
  studentId: number;
  occurredOn: string;
  problem: string;
  answer: string;
  cause: Cause;
  status: MissStatus;
  ruleIds: string[];
};

/** Someone a plan can be e-mailed to (`GET /members`). */
export type Recipient = {
  id: number;
  displayName: string;
  email: string;
  role: Role;
  isYou: boolean;
};

/** The household's children as these pages need them (the route passes them in). */
export type StudentRef = { id: number; name: string };

/** `'2026-03-12'` → `'Thursday 12 March 2026'` (in the reader's locale). */
export function longDay(day: string): string {
  const date = new Date(`${day}T12:00:00`);
  if (Number.isNaN(date.getTime())) return day;
  return date.toLocaleDateString(undefined, {
    weekday: 'long',
    day: 'numeric',
    month: 'long',
    year: 'numeric',
  });
}

/** `'2026-03-12'` → `'12 Mar'`. */
export function shortDay(day: string): string {
  const date = new Date(`${day}T12:00:00`);
  if (Number.isNaN(date.getTime())) return day;
  return date.toLocaleDateString(undefined, { day: 'numeric', month: 'short' });
}
