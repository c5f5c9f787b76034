import type { Answer, Problem, ReadError } from '../parse/types.js';
import type { WorkingTrace } from '../trace/types.js';
import type { CheckResult } from '../checks/types.js';
import type { Cause } from '../domain/causes.js';

/** A basic fact the child's working needs to be wrong: 7 × 8 written 54. */
export interface FactError {
  readonly op: '+' | '-' | 'x' | '÷';
  readonly a: number;
  readonly b: number;
  readonly expected: number;
  readonly written: number;
  /** Where the fact was used, e.g. `'tens column'`. */
  readonly where: string;
}

/** Where the child's working first departs from the correct working. */
export interface FirstWrongStep {
  /** The column or step, e.g. `'ones'`, `'remainder'`, `'partial product 2'`. */
  readonly place: string;
  readonly expected: string;
  /** What the child wrote there (`''` when nothing was written). */
  readonly written: string;
  readonly note: string;
}

/** One error rule, or a pair of them, that reproduces the child's answer. */
export interface RuleMatch {
  /** The rule id, or two ids joined with `+` for a pair (`'sub.borrow-no-decrement+sub.fact'`). */
  readonly id: string;
  readonly ids: readonly string[];
  /** 1 for a single systematic rule, lower for fact rules and pairs; the list is ranked by it. */
  readonly score: number;
  /** Plain words for a parent, naming the column and digits. */
  readonly explanation: string;
  /** The working as the rule does it, to draw beside the correct one. */
  readonly trace: WorkingTrace | null;
}

/** The child's written intermediate steps, when the parent enters them. */
export interface WrittenSteps {
  /** Long multiplication: the partial products as written, top to bottom (ones digit of the multiplier first), with their placeholder zeros (68, 340). */
  readonly partials?: readonly string[];
  /** Long division: the quotient digits and numbers written under the dividend, in order (product, difference, …). */
  readonly lines?: readonly string[];
}

/**
 * One step the child wrote, beside the same step of the usual working.
 * Partial products are labelled `'partial product 1'`, `'partial product 2'` … (ones digit of
 * the multiplier first); long-division lines `'step 1 product'`, `'step 1 difference'` ….
 * `{ label: 'partial product 2', work: '347 × 2, one place left', expected: '6940',
 *    written: '6840', ok: false, finding: { ids: ['mul.no-carry'], oneOff: true, explanation: '…' } }`
 */
export interface WrittenStepCheck {
  readonly label: string;
  /** What the step works out, in plain symbols (`'347 × 6'`, `'4 × 7'`, `'30 − 28'`); `''` past the end of the working. */
  readonly work: string;
  /** The step in the usual working, digits only; `''` when the child wrote a step the working does not have. */
  readonly expected: string;
  /** The step as the child wrote it, digits only (commas and leading zeros removed); `''` when missing. */
  readonly written: string;
  readonly ok: boolean;
  /**
   * For a wrong step, what reproduces it when the step is worked on its own: the rule ids
   * (or `['mul.fact']`), whether the child's other written steps show it was a one-off
   * (`oneOff: true`: the same thing was done right elsewhere) and plain words for a parent.
   * Null for a right step or when nothing reproduces it.
   */
  readonly finding: {
    readonly ids: readonly string[];
    readonly oneOff: boolean;
    readonly explanation: string;
  } | null;
}

/**
 * The child's written steps compared with the usual working, for drawing them (web panel,
 * stored diagnosis, plan, PDF). `firstDiffers` is the index in `steps` of the first step that
 * differs (null when all agree).
 * `{ kind: 'partials', steps: [{ label: 'partial product 1', ok: true, … }, { label: 'partial product 2', ok: false, … }], firstDiffers: 1 }`
 */
export interface WrittenStepsReport {
  readonly kind: 'partials' | 'lines';
  readonly steps: readonly WrittenStepCheck[];
  readonly firstDiffers: number | null;
}

/** A likely cause to offer the parent, who decides; never a verdict. */
export interface SuggestedCause {
  readonly cause: Extract<Cause, 'step' | 'fact' | 'slip' | 'copying'>;
  readonly because: string;
  readonly ruleIds: readonly string[];
}

/** The engine's findings for one problem and answer (the Diagnosis JSON of DESIGN.md). */
export interface Diagnosis {
  readonly ok: true;
  readonly problem: Problem;
  readonly expected: string;
  readonly answer: string;
  readonly parsedAnswer: Answer;
  readonly correct: boolean;
  readonly firstWrongStep: FirstWrongStep | null;
  readonly rules: readonly RuleMatch[];
  readonly facts: readonly FactError[];
  readonly checks: { readonly nines: CheckResult; readonly elevens: CheckResult };
  /** The correct working, and the child's working when the best-ranked rule reproduces it. */
  readonly trace: {
    readonly expected: WorkingTrace;
    readonly child: { readonly ruleId: string; readonly working: WorkingTrace } | null;
  };
  readonly suggestedCause: SuggestedCause | null;
  /** Extra remarks for the parent (e.g. a right value not in simplest form). */
  readonly notes: readonly string[];
  /**
   * The written steps the parent entered (`options.steps`), each beside the usual working's
   * step, and the first that differs; null when no steps were given (or the problem has none).
   * Hypotheses that contradict a step written right are not in `rules`.
   */
  readonly writtenSteps: WrittenStepsReport | null;
  readonly engineVersion: string;
}

/** When the problem, the answer or the steps cannot be read. */
export interface Unreadable {
  readonly ok: false;
  readonly part: 'problem' | 'answer' | 'steps';
  readonly error: ReadError;
}

export type DiagnoseResult = Diagnosis | Unreadable;

/** A rule (or pair) that reproduced the answer, before ranking; `facts` are the facts it needs wrong. */
export interface Candidate {
  readonly ids: readonly string[];
  readonly explanation: string;
  readonly trace: WorkingTrace | null;
  readonly facts: readonly FactError[];
  /** Breaks ties between candidates of the same score before catalog order (lower first; default 0). */
  readonly rank?: number;
}

/** What one operation's diagnoser hands back to `diagnose`. */
export interface Findings {
  readonly expected: string;
  readonly expectedTrace: WorkingTrace;
  readonly correct: boolean;
  readonly matches: readonly Candidate[];
  readonly firstWrongStep: FirstWrongStep | null;
  readonly notes: readonly string[];
  /** The written steps compared with the usual working (multiplication and division), when given. */
  readonly writtenSteps?: WrittenStepsReport | null;
}
