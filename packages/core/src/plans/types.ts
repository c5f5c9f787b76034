import type { PatternMiss } from '../patterns/types.js';

/** A miss chosen for a review plan: the pattern fields plus the lessons its key names. */
export interface PlanMiss extends PatternMiss {
  /** Lessons to revisit for it, as numbers (`[12, 13]`). */
  readonly lessons: readonly number[];
  /** `true` when the engine finds the child's answer right (then there is nothing to re-work). */
  readonly engineSaysRight?: boolean;
  /** The right answer, when the engine worked it out. */
  readonly expected?: string | null;
}

/** A lesson of the curriculum named in a plan: its number and its title (null when unknown). */
export interface PlanLesson {
  readonly number: number;
  readonly title: string | null;
}

export interface LessonRange {
  readonly from: number;
  readonly to: number;
  /** `'Lessons 12–14'` or `'Lesson 20'`. */
  readonly label: string;
  /** Each lesson of the range with its title from the curriculum. */
  readonly lessons?: readonly PlanLesson[];
  readonly missIds: readonly number[];
}

export interface PracticeActivity {
  readonly id:
    'flash-cards' | 'timer-game' | 'skip-counting' | 'through-ten' | 'draw-rows' | 'near-doubles';
  readonly title: string;
  /** What to do, in two or three plain sentences. */
  readonly how: string;
}

export interface FactFamilyDrill {
  readonly family: string;
  readonly label: string;
  /** The wrong facts this drill covers, `['7 × 8', '6 × 7']`. */
  readonly facts: readonly string[];
  readonly activity: PracticeActivity;
  /** Other activities that suit the same family, to vary the drill from day to day. */
  readonly alternatives?: readonly PracticeActivity[];
  readonly missIds: readonly number[];
}

export interface PracticeBlock {
  readonly ruleId: string;
  readonly title: string;
  readonly digits: number;
  /** Numbered through the whole plan so the answers page can follow. */
  readonly problems: readonly {
    readonly number: number;
    readonly problem: string;
    readonly answer: string;
  }[];
  readonly missIds: readonly number[];
}

export type PlanItemKind = 'lesson' | 'fact-family' | 'practice' | 'miss';

/** One line of the plan's checklist, with the misses it covers. */
export interface PlanItemDraft {
  readonly kind: PlanItemKind;
  /** Stable within a plan: `'lesson:12-14'`, `'fact:x7'`, `'practice:sub.borrow-across-zero'`, `'miss:41'`. */
  readonly key: string;
  readonly title: string;
  readonly payload:
    | LessonRange
    | FactFamilyDrill
    | PracticeBlock
    | {
        readonly missId: number;
        readonly problem: string;
        readonly answer: string;
        readonly occurredOn: string;
      };
  readonly missIds: readonly number[];
}

/** A miss picked for the plan's first page, and why. */
export interface FocusProblem {
  readonly missId: number;
  readonly problem: string;
  readonly answer: string;
  readonly expected: string | null;
  readonly occurredOn: string;
  /** How many of the plan's misses share its difficulty (itself included). */
  readonly recurs: number;
  /** `'The same difficulty as 3 other problems on this plan: borrowing across a zero.'` */
  readonly reason: string;
}

/** What the plan's first page says: lessons, facts and the problems most worth re-working. */
export interface PlanSummary {
  readonly lessons: readonly string[];
  readonly facts: readonly string[];
  readonly focus: readonly FocusProblem[];
}

export interface ReviewPlanDraft {
  readonly lessons: { readonly text: string; readonly ranges: readonly LessonRange[] };
  readonly factFamilies: readonly FactFamilyDrill[];
  readonly practice: readonly PracticeBlock[];
  /** The checklist: lessons, fact families, practice, then each miss to re-work. */
  readonly items: readonly PlanItemDraft[];
  /** The pattern keys the plan's misses show (see `patternKeysOf`), for fading later. */
  readonly covers: readonly string[];
  /** Rules for which no practice could be made, and misses left out, with why. */
  readonly notes: readonly string[];
  readonly summary: PlanSummary;
  /** Misses left off the plan because the engine finds their answer right. */
  readonly leftOut: readonly number[];
}
