// Inputs and results of the pattern maths. Inputs are plain data the API reads from its
// rows (dates as YYYY-MM-DD, no clock); results are JSON the web draws as they are.

import type { Cause } from '../domain/causes.js';
import type { FactError, RuleMatch } from '../diagnose/types.js';

/** What the pattern maths needs of a stored diagnosis (a full `Diagnosis` fits). */
export interface StoredDiagnosis {
  readonly rules: readonly Pick<RuleMatch, 'id' | 'ids'>[];
  readonly facts: readonly Pick<FactError, 'op' | 'a' | 'b' | 'expected' | 'written'>[];
}

/** One miss as the pattern maths reads it. */
export interface PatternMiss {
  readonly id: number;
  /** The day of the work, YYYY-MM-DD. */
  readonly occurredOn: string;
  readonly cause: Cause;
  readonly skills: readonly string[];
  readonly problem: string;
  readonly answer: string;
  /** `null` when the engine could not read the problem. */
  readonly diagnosis: StoredDiagnosis | null;
}

/** An item the child got right in a sitting: the problem and the right answer. */
export interface RightItem {
  readonly occurredOn: string;
  readonly problem: string;
  readonly answer: string;
}

/** A review plan as far as fading is concerned: its date and the pattern keys it covered. */
export interface ReviewedPlan {
  readonly id: number;
  readonly scheduledFor: string;
  readonly covers: readonly string[];
}

/** A basic fact as Workback writes it: `{ op: 'x', a: 7, b: 8 }` is 7 × 8. */
export interface BasicFact {
  readonly op: '+' | '-' | 'x' | '÷';
  readonly a: number;
  readonly b: number;
}

export interface Seen {
  readonly count: number;
  readonly firstSeen: string;
  readonly lastSeen: string;
  readonly missIds: readonly number[];
}

/** Misses of one ISO week by cause (every cause present, zero when none). */
export interface WeekCauseMix {
  /** ISO 8601 week, e.g. `'2026-W10'`. */
  readonly week: string;
  /** Monday and Sunday of the week. */
  readonly from: string;
  readonly to: string;
  readonly total: number;
  readonly causes: Readonly<Record<Cause, number>>;
}

export interface RuleCount extends Seen {
  readonly ruleId: string;
  readonly title: string;
  readonly kind: 'systematic' | 'fact';
}

export interface SkillCount extends Seen {
  readonly skill: string;
}

export interface FactCount extends Seen {
  readonly op: BasicFact['op'];
  readonly a: number;
  readonly b: number;
  readonly expected: number;
  /** `'7 × 8'`. */
  readonly text: string;
  /** What the child wrote for it, one entry per miss. */
  readonly written: readonly number[];
  readonly families: readonly string[];
}

export interface FamilyCount extends Seen {
  /** `'x7'` (× and ÷ facts with 7) or `'+8'` (+ and − facts with 8). */
  readonly family: string;
  readonly label: string;
  /** The distinct facts of the family that were wrong, most often first. */
  readonly facts: readonly string[];
}

/**
 * The fact-gap grid: `addition[a][b]` and `multiplication[a][b]` for 0–10 count how often
 * that fact was wrong. A fact and its turnaround are one fact (7 × 8 fills [7][8] and
 * [8][7]); a subtraction or division fact fills the cell of its addition or
 * multiplication fact (15 − 8 = 7 is 8 + 7).
 */
export interface FactGaps {
  readonly addition: readonly (readonly number[])[];
  readonly multiplication: readonly (readonly number[])[];
  readonly list: readonly FactCount[];
  readonly families: readonly FamilyCount[];
}

export type PatternKind = 'rule' | 'fact' | 'skill';

/** Where a recurring pattern stands since the last review plan that covered it. */
export interface SincePlan {
  readonly planId: number;
  readonly scheduledFor: string;
  /** Misses with this pattern dated after the plan's day. */
  readonly seenAgain: number;
  readonly lastSeen: string | null;
}

export interface RecurringPattern extends Seen {
  /** `'rule:sub.borrow-across-zero'`, `'fact:x7'`, `'skill:subtraction.regrouping'`. */
  readonly key: string;
  readonly kind: PatternKind;
  readonly id: string;
  readonly label: string;
  /** The busiest window of `windowDays` days (earliest when tied). */
  readonly window: { readonly from: string; readonly to: string; readonly count: number };
  /** `not-reviewed` — no plan has covered it yet; `faded` — not seen after the last plan that did; `seen-again` — seen after it. */
  readonly status: 'not-reviewed' | 'faded' | 'seen-again';
  readonly sincePlan: SincePlan | null;
  /** One plain sentence for a parent. */
  readonly sentence: string;
}

export interface MissEvidence {
  readonly missId: number;
  readonly occurredOn: string;
  readonly problem: string;
  readonly answer: string;
}

export interface Contradiction {
  readonly occurredOn: string;
  readonly problem: string;
  /** The right answer the child gave. */
  readonly answer: string;
  /** What the rule would have written instead. */
  readonly ruleWrites: string;
}

export interface RuleFinding {
  readonly ruleId: string;
  readonly title: string;
  /** `finding` — explains 2 or more misses and no right item contradicts it; otherwise `possible`. */
  readonly status: 'finding' | 'possible';
  /** Misses the rule reproduces on its own. */
  readonly explains: number;
  /** Misses it reproduces only together with another rule. */
  readonly inPairs: number;
  readonly evidence: readonly MissEvidence[];
  readonly contradictions: readonly Contradiction[];
  /** `explains − contradictions`; the list is ranked by status, then this. */
  readonly score: number;
  /** The related-rules family it belongs to, if any (`'zero-regrouping'`). */
  readonly group: string | null;
}

export interface FindingGroup {
  readonly group: string;
  readonly title: string;
  readonly ruleIds: readonly string[];
  readonly weeks: readonly string[];
  readonly evidence: readonly MissEvidence[];
  /** Right items every one of the group's seen rules would have broken. */
  readonly contradictions: readonly Contradiction[];
  readonly status: 'finding' | 'possible';
  readonly sentence: string;
}

export interface Findings {
  readonly rules: readonly RuleFinding[];
  readonly groups: readonly FindingGroup[];
}

/** One difficulty as a tutor reads it: rules, skill and rule family merged into one card. */
export interface Difficulty {
  /** `'group:zero-regrouping'`, `'rule:add.no-carry'`, `'fact:x7'`, `'skill:remainders'`. */
  readonly key: string;
  readonly kind: 'method' | 'fact' | 'skill';
  /** A plain name: the rule family's title, a unique rule name, a fact family or the skill's own words. */
  readonly title: string;
  /** `finding` — one of its rules meets the page's definition; `recurring` — came back 3+ times in 30 days; else `possible`. */
  readonly status: 'finding' | 'recurring' | 'possible';
  readonly sentence: string;
  readonly ruleIds: readonly string[];
  /** The skills its misses are on, in the answer key's own words. */
  readonly skills: readonly string[];
  /** The recurring pattern keys merged into it (notes are kept under the first). */
  readonly patternKeys: readonly string[];
  readonly count: number;
  /** Its misses, latest first. */
  readonly evidence: readonly MissEvidence[];
  /** The recurring pattern with most misses merged into it, if any (review status). */
  readonly recurring: RecurringPattern | null;
  readonly contradictions: readonly Contradiction[];
}

export interface Patterns {
  readonly causeMix: readonly WeekCauseMix[];
  readonly rules: readonly RuleCount[];
  readonly skills: readonly SkillCount[];
  readonly facts: FactGaps;
  readonly recurring: readonly RecurringPattern[];
  readonly findings: Findings;
  /** One card per difficulty (see `groupDifficulties`). */
  readonly difficulties: readonly Difficulty[];
}
