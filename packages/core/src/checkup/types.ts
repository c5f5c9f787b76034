/**
 * The right working is always one hypothesis. It also stands for "the miss was a one-off
 * slip": a child whose method is right writes right answers on fresh problems.
 */
export const RIGHT_WORKING = 'correct';

/** One problem of a check-up sheet, with the answer each hypothesis would write. */
export interface CheckUpProblem {
  /** The problem as Workback prints it, e.g. `'602 − 48'`. */
  readonly problem: string;
  /** `correct` and every rule id of the sheet → the answer that working writes. */
  readonly answers: Readonly<Record<string, string>>;
}

/** A rule asked for that has no fixed wrong method, so it joins the right-working hypothesis. */
export interface MergedCandidate {
  readonly id: string;
  readonly reason: string;
}

export type CheckUpPlan =
  | {
      readonly ok: true;
      /** The operation every candidate works on (`'subtraction'`, `'fraction'`, …). */
      readonly operation: string;
      /** `correct` first, then the candidate rules with a fixed method, in catalog order. */
      readonly hypotheses: readonly string[];
      readonly problems: readonly CheckUpProblem[];
      readonly merged: readonly MergedCandidate[];
      /** Pairs of hypotheses the sheet tells apart fewer than twice (empty on a good sheet). */
      readonly unseparated: readonly (readonly [string, string])[];
    }
  | { readonly ok: false; readonly error: { readonly message: string } };

/** How one hypothesis fared against the child's answers on a check-up. */
export interface HypothesisScore {
  readonly id: string;
  /** Problems on which the child wrote exactly what this working writes. */
  readonly matches: number;
  /** Problems on which the child wrote what another working writes, but not this one. */
  readonly misses: number;
  readonly of: number;
}

/**
 * What a check-up's answers say. `confirmed`: one hypothesis is contradicted by none of the
 * answers (at most one answer fits no working at all: a slip), and every other is contradicted
 * more often. `open`: the answers do not single one out.
 */
export interface CheckUpReading {
  readonly verdict: 'confirmed' | 'open';
  /** The best-fitting hypothesis when confirmed, else `null`. */
  readonly confirmed: string | null;
  /** Hypotheses contradicted twice or more, or at all when another is confirmed. */
  readonly ruledOut: readonly string[];
  /** Hypotheses still possible (the confirmed one included). */
  readonly open: readonly string[];
  readonly scores: readonly HypothesisScore[];
}
