export const KEY_KINDS = ['worksheet', 'review', 'assessment'] as const;
export type KeyKind = (typeof KEY_KINDS)[number];

export const KEY_KIND_LABEL: Readonly<Record<KeyKind, string>> = {
  worksheet: 'Worksheet',
  review: 'Review',
  assessment: 'Assessment',
};

/** The API's own cross-check of one item (the engine worked the prompt out). */
export type ItemCheck =
  | { status: 'agrees'; expected: string }
  | { status: 'disagrees'; expected: string; message: string }
  | { status: 'unreadable-answer'; expected: string; message: string }
  | { status: 'not-checked' };

export type KeyItem = {
  id: number;
  number: number;
  prompt: string;
  answer: string;
  skills: string[];
  /** As written: numbers and ranges, `['12', '31-33']`. */
  revisit: string[];
  /** Every lesson those name, `[12, 31, 32, 33]`. */
  revisitLessons: number[];
  facts: string[];
  check: ItemCheck;
};

export type FieldChange = { from: unknown; to: unknown };

export type KeyCorrection = {
  id: number;
  itemId: number | null;
  itemNumber: number;
  changes: Record<string, FieldChange>;
  reason: string;
  madeBy: { userId: number | null; name: string };
  createdAt: string;
  remarkedSittingIds: number[];
};

export type AnswerKeySummary = {
  id: number;
  title: string;
  kind: KeyKind;
  courseId: number | null;
  lessonNumber: number | null;
  itemCount: number;
  flagCount: number;
  sittingCount: number;
  createdAt: string;
  updatedAt: string;
};

export type AnswerKey = Omit<AnswerKeySummary, 'flagCount'> & {
  items: KeyItem[];
  flags: { itemId: number; number: number; status: string; expected: string; message: string }[];
  corrections: KeyCorrection[];
};

export type RemarkedSitting = {
  sittingId: number;
  studentId: number;
  before: { correct: number; marked: number };
  after: { correct: number; marked: number };
  itemIds: number[];
  resolvedMissIds: number[];
  newMissIds: number[];
};

/** `PATCH /answer-keys/:id` answers the key and what the edit did to its sittings. */
export type KeyUpdateResult = AnswerKey & {
  newCorrections: KeyCorrection[];
  remarkedSittings: RemarkedSitting[];
};

export type KeyItemInput = {
  id?: number;
  number: number;
  prompt: string;
  answer: string;
  skills: string[];
  revisit: string[];
  facts: string[];
};

export type KeyFieldsInput = {
  title: string;
  kind: KeyKind;
  courseId: number | null;
  lessonNumber: number | null;
};

/** The few course facts the key pages show (the route passes them in from the curriculum). */
export type CourseOption = { id: number; name: string };
