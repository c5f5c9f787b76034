/** A check-up as the API gives it: the sheet, and once taken, what the answers said. */
export type CheckUp = {
  id: number;
  studentId: number;
  answerKeyId: number;
  sittingId: number | null;
  ruleIds: string[];
  operation: string;
  hypotheses: { id: string; name: string }[];
  problems: { problem: string; answers: Record<string, string> }[];
  merged: { id: string; reason: string }[];
  status: 'not taken' | 'confirmed' | 'open';
  reading: {
    verdict: 'confirmed' | 'open';
    confirmed: string | null;
    ruledOut: string[];
    open: string[];
    scores: { id: string; matches: number; misses: number; of: number }[];
    sentence: string;
    /** The child's answers as entered, one per problem (null for a blank). */
    answers: (string | null)[];
  } | null;
  createdAt: string;
};

export type CheckUpInput = { studentId: number; ruleIds: string[]; digits?: number };

export type CheckUpAnswers = {
  startedAt: string;
  minutes: number | null;
  conditions: { rested: boolean | null; afterMeal: boolean | null; note: string | null };
  answers: (string | null)[];
};

/** The id the right working goes by in every check-up. */
export const RIGHT_WORKING = 'correct';
