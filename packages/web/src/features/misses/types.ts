import {
  CAUSE_GUIDE,
  MISS_STATUS_LABEL,
  RULE_GROUPS,
  ruleName,
  type Cause,
  type CheckedLines,
  type Diagnosis,
  type InterviewStage,
  type MissKind,
  type MissStatus,
  type WrittenSteps,
} from '@workback/core';

/** A pin on a photo, as fractions of its width and height. */
export type PhotoMark = { id?: number; x: number; y: number; label: string | null };

export type MissPhoto = {
  id: number;
  position: number;
  contentType: string;
  width: number;
  height: number;
  bytes: number;
  thumbWidth: number;
  thumbHeight: number;
  imageUrl: string;
  thumbUrl: string;
  marks: PhotoMark[];
  createdAt: string;
};

/** A row of the notebook (`GET /misses`): everything but the full diagnosis and photos. */
export type MissSummary = {
  id: number;
  studentId: number;
  occurredOn: string;
  sittingId: number | null;
  keyItemId: number | null;
  problem: string;
  answer: string;
  steps: WrittenSteps | null;
  explanation: string;
  cause: Cause;
  note: string;
  status: MissStatus;
  skills: string[];
  revisit: string[];
  /** A word problem's number sentences, one per line (null when none were recorded). */
  lines?: string[] | null;
  /** Where the word problem went wrong, by the interview prompts. */
  stage?: InterviewStage | null;
  /** The notebook's kind: whole, fraction, decimal, money, time, word or other. */
  kind?: MissKind;
  checked: boolean;
  notCheckedReason: string | null;
  expected: string | null;
  correct: boolean | null;
  ruleIds: string[];
  suggestedCause: Cause | null;
  engineVersion: string | null;
  createdBy: number | null;
  updatedBy: number | null;
  createdAt: string;
  updatedAt: string;
  thumbnailPhotoId: number | null;
  photoCount: number;
};

/**
 * A list row's photo: the API's 128 px square (twice the 64 px a card shows), a tenth of the
 * thumbnail's bytes, so a notebook page opens fast on a weak connection.
 */
export const smallPhotoUrl = (photoId: number) => `/api/photos/${photoId}/small`;

/** One miss with its diagnosis and photos (`GET /misses/:id`). */
export type Miss = MissSummary & {
  diagnosis: Diagnosis | null;
  photos: MissPhoto[];
  /** The number sentences checked line by line, when there are any. */
  linesCheck?: CheckedLines | null;
};

export type MissPage = { items: MissSummary[]; total: number; page: number; pageSize: number };

export type Note = {
  id: number;
  missId: number;
  body: string;
  author: { id: number; displayName: string } | null;
  createdAt: string;
};

/** What the Log-a-miss form sends (multipart, with the photos). */
export type MissInput = {
  studentId: number;
  occurredOn: string;
  problem: string;
  answer: string;
  steps: WrittenSteps | null;
  explanation: string;
  cause: Cause;
  note: string;
  /** A word problem's number sentences, one per line. */
  lines?: string[];
  stage?: InterviewStage | null;
};

export type MissChanges = Partial<Omit<MissInput, 'steps'>> & {
  steps?: WrittenSteps | null;
  status?: MissStatus;
};

/** The notebook's filters, as kept in the address bar. */
export type MissFilters = {
  studentId?: number;
  cause?: Cause;
  status?: MissStatus;
  kind?: MissKind;
  stage?: InterviewStage;
  rule?: string;
  skill?: string;
  from?: string;
  to?: string;
  q?: string;
  sort: string;
  page: number;
  pageSize: number;
};

export const DEFAULT_SORT = '-occurredOn';
export const PAGE_SIZE = 25;

/** `causeLabel('step')` → `'Method step'`. */
export const causeLabel = (cause: Cause): string => CAUSE_GUIDE[cause]?.label ?? cause;

/** `statusLabel('discussed')` → `'Talked through'`. */
export const statusLabel = (status: MissStatus): string => MISS_STATUS_LABEL[status] ?? status;

/**
 * `ruleTitle('add.no-carry')` → `'Carry dropped (addition)'`: the catalog's title, made unique
 * with the operation where two rules share it; a pair joins both.
 */
export function ruleTitle(id: string): string {
  return id.split('+').map(ruleName).join(' + ');
}

/**
 * The rule a notebook row names: the one the list is filtered by when the miss has it (alone
 * or in a pair; for a family, `group:zero-regrouping`, one of the family's), else its
 * best-ranked rule. So a filtered list never names another rule.
 */
export function shownRule(
  ruleIds: readonly string[],
  filterRule: string | null,
): string | undefined {
  if (filterRule) {
    const wanted = RULE_GROUPS.find((g) => `group:${g.group}` === filterRule)?.ruleIds ?? [
      filterRule,
    ];
    const hit = ruleIds.find((id) => id.split('+').some((r) => wanted.includes(r)));
    if (hit) return hit;
  }
  return ruleIds[0];
}

/** `formatDay('2026-03-04')` → `'4 Mar 2026'` (a calendar day, so no time-zone shift). */
export function formatDay(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  if (!y || !m || !d) return day;
  return new Date(y, m - 1, d).toLocaleDateString(undefined, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
  });
}

/** Today in the parent's own time zone, as YYYY-MM-DD. */
export function today(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

/** The students a page offers, handed in by the app layer (features do not import each other). */
export type StudentOption = { id: number; name: string };
