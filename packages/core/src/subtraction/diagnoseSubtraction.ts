import type { Answer, Problem } from '../parse/types.js';
import type { SubtractionColumn } from '../trace/types.js';
import { placeColumn, placeName } from '../numbers/digits.js';
import { describeOutcome } from '../diagnose/describeOutcome.js';
import { findFactSlip, type FactCell } from '../diagnose/findFactSlip.js';
import { slipsInRule, type SlipSite } from '../diagnose/slipsInRule.js';
import { wrongFacts } from '../diagnose/wrongFacts.js';
import { diagnoseWholeAnswer } from '../diagnose/diagnoseWholeAnswer.js';
import type { Candidate, FactError, Findings } from '../diagnose/types.js';
import { runSubtraction } from './runSubtraction.js';
import { subtractColumns, type SubtractionMethod, type SubtractionRun } from './subtractColumns.js';

type SubtractionProblem = Extract<Problem, { kind: 'subtraction' }>;

/** A basic-fact slip inside a rule's working: the difference of this column, right and as taken. */
interface SubtractionSlip {
  readonly column: number;
  readonly fact: FactError;
}

interface SubtractionRule {
  readonly id: string;
  readonly method: SubtractionMethod;
  /**
   * The rule's words, worked on `run`. With a slip in the same working (`run` then carries
   * it), the column the rule speaks of tells the slipped difference, never the right one as
   * if the child had used it.
   */
  readonly explain: (
    problem: SubtractionProblem,
    run: SubtractionRun,
    slip?: SubtractionSlip,
  ) => string;
  /** The column whose difference the rule's sentence works out, when it speaks of one. */
  readonly at?: (run: SubtractionRun) => number;
}

/**
 * A difference the rule's sentence works out: `'13 − 5 = 8'`; just `'13 − 5'` when the slip
 * beside it is this very fact taken otherwise, so one explanation never states both.
 */
function difference(a: number, b: number, shown: number, slip?: SubtractionSlip): string {
  return slip !== undefined && slip.fact.a === a && slip.fact.b === b
    ? `${a} − ${b}`
    : `${a} − ${b} = ${shown}`;
}

/** `'13 − 5 was taken as 9 instead of 8'`. */
const slipped = (f: FactError): string =>
  `${f.a} − ${f.b} was taken as ${f.written} instead of ${f.expected}`;

const col = (run: SubtractionRun, k: number): SubtractionColumn =>
  run.trace.columns[k] as SubtractionColumn;

/** The first column where the given part of the method departed from the correct method. */
function firstFired(run: SubtractionRun, part: keyof SubtractionMethod): SubtractionColumn {
  return col(run, run.fired.find((f) => f.part === part)?.column ?? 0);
}

/** The subtraction rules of the catalog, each as a change to the column method. */
export const SUBTRACTION_RULES: readonly SubtractionRule[] = [
  {
    id: 'sub.smaller-from-larger',
    method: { compare: 'smaller-from-larger' },
    at: (run) => firstFired(run, 'compare').index,
    explain: (_p, run, slip) => {
      const c = firstFired(run, 'compare');
      const need = `In the ${placeColumn(c.index)} ${c.used} − ${c.bottom ?? 0} needs regrouping`;
      return slip?.column === c.index
        ? `${need}; instead the smaller digit was taken from the larger, and ${slipped(slip.fact)}.`
        : `${need}; instead ${difference(c.bottom ?? 0, c.used, c.written, slip)} was written, taking the smaller digit from the larger.`;
    },
  },
  {
    id: 'sub.borrow-no-decrement',
    method: { decrement: false },
    at: (run) => firstFired(run, 'decrement').index,
    explain: (_p, run, slip) => {
      const c = firstFired(run, 'decrement');
      const left = run.trace.columns[c.index + 1];
      const lender =
        left === undefined
          ? ''
          : (left.marks[0] ?? 0) === 0
            ? ' (it stayed 0; the usual working takes one from the digit to its left, and the 0 becomes 9)'
            : ` (it stayed ${left.marks[0] ?? 0} instead of becoming ${(left.marks[0] ?? 0) - 1})`;
      const nothing = `but nothing was taken from the ${placeName(c.index + 1)} digit${lender}`;
      return slip?.column === c.index
        ? `In the ${placeColumn(c.index)} ten was added to make ${c.used}, ${nothing}; then ${slipped(slip.fact)}.`
        : `In the ${placeColumn(c.index)} ten was added to make ${difference(c.used, c.bottom ?? 0, c.written, slip)}, ${nothing}.`;
    },
  },
  {
    id: 'sub.borrow-across-zero',
    method: { zeros: 'skip' },
    explain: (_p, run) => {
      const c = firstFired(run, 'zeros');
      const step = run.trace.regroupings.find((r) => r.to === c.index && r.kind === 'skip-zeros');
      const from = step?.from ?? c.index + 1;
      const lender = col(run, from);
      return `In the ${placeColumn(c.index)} regrouping was needed and the ${placeName(c.index + 1)} digit is 0: the ten was taken straight from the ${placeName(from)} (${lender.marks[0]} became ${lender.marks[1]}), skipping the 0, which stayed 0 instead of becoming 9.`;
    },
  },
  {
    id: 'sub.borrow-from-zero',
    method: { zeros: 'stop' },
    explain: (_p, run) => {
      const c = firstFired(run, 'zeros');
      const next = run.trace.columns[c.index + 2];
      const further =
        next === undefined
          ? ''
          : `, but nothing was taken from the ${placeName(c.index + 2)} (it stayed ${next.marks[0]})`;
      return `In the ${placeColumn(c.index)} regrouping was needed from the 0 in the ${placeName(c.index + 1)} column: the 0 was changed to 9${further}.`;
    },
  },
  {
    id: 'sub.zero-minus-n-is-n',
    method: { zeroTop: 'n' },
    explain: (_p, run, slip) => {
      const c = firstFired(run, 'zeroTop');
      return `In the ${placeColumn(c.index)} 0 − ${c.bottom ?? 0} was written as ${c.written}, instead of regrouping to make ${difference(10, c.bottom ?? 0, 10 - (c.bottom ?? 0), slip)}.`;
    },
  },
  {
    id: 'sub.zero-minus-n-is-zero',
    method: { zeroTop: 'zero' },
    explain: (_p, run, slip) => {
      const c = firstFired(run, 'zeroTop');
      return `In the ${placeColumn(c.index)} 0 − ${c.bottom ?? 0} was written as 0, instead of regrouping to make ${difference(10, c.bottom ?? 0, 10 - (c.bottom ?? 0), slip)}.`;
    },
  },
  {
    id: 'sub.n-minus-zero-is-zero',
    method: { minusZero: 'zero' },
    explain: (_p, run) => {
      const c = firstFired(run, 'minusZero');
      return `In the ${placeColumn(c.index)} ${c.used} − 0 was written as 0; taking away nothing leaves ${c.used}.`;
    },
  },
  {
    id: 'sub.left-aligned',
    method: { align: 'left' },
    explain: (p, run) =>
      `${p.subtrahend} was lined up on the left, under the first digits of ${p.minuend} (as if it were ${p.subtrahend}${'0'.repeat(run.trace.bottom.shift)}), instead of lining up the ones digits on the right.`,
  },
];

/** The first column where a rule's part of the method fired; -1 for lining up (before any column). */
function firstColumnOf(run: SubtractionRun, method: SubtractionMethod): number {
  if ('align' in method) return -1;
  return run.fired.find((f) => f.part in method)?.column ?? -1;
}

/** Rules that set the same part of the method cannot combine. */
const conflict = (a: SubtractionMethod, b: SubtractionMethod): boolean =>
  Object.keys(a).some((key) => key in b);

const factSentence = (f: FactError): string => `In the ${f.where} ${slipped(f)}.`;

function factError(c: SubtractionColumn, written: number): FactError | null {
  if (c.bottom === null) return null;
  return {
    op: '-',
    a: c.used,
    b: c.bottom,
    expected: c.written,
    written,
    where: placeColumn(c.index),
  };
}

/** Whether a column's digit was written by rote (0 − N or N − 0 by a rule), not worked out. */
const byRote = (run: SubtractionRun, k: number): boolean =>
  run.fired.some((f) => f.column === k && (f.part === 'zeroTop' || f.part === 'minusZero'));

/** The fact a run works out in column `k` (smaller from larger reverses it), written as `written`. */
function factOf(run: SubtractionRun, k: number, written: number): FactError {
  const c = col(run, k);
  const reversed = run.fired.some((f) => f.column === k && f.part === 'compare');
  const [a, b] = reversed ? [c.bottom ?? 0, c.used] : [c.used, c.bottom ?? 0];
  return { op: '-', a, b, expected: a - b, written, where: placeColumn(k) };
}

/** Every column fact of a run where a slip could sit. */
function slipSites(
  run: SubtractionRun,
): (SlipSite<NonNullable<SubtractionMethod['slip']>> & { column: number })[] {
  return run.trace.columns
    .filter((c) => c.bottom !== null && !byRote(run, c.index))
    .map((c) => {
      const f = factOf(run, c.index, c.written);
      return {
        column: c.index,
        position: c.index,
        right: f.expected,
        wrong: wrongFacts('-', f.a, f.b),
        slip: (difference: number) => ({ column: c.index, difference }),
      };
    });
}

/**
 * Diagnoses a column subtraction: the correct working, every rule (and pair) that
 * reproduces the answer, and the first column that differs.
 * `diagnoseSubtraction(parse('304 - 75'), whole('139')).matches[0].ids` → `['sub.borrow-across-zero']`.
 */
export function diagnoseSubtraction(problem: SubtractionProblem, answer: Answer): Findings {
  const correct = subtractColumns(problem.minuend, problem.subtrahend) as SubtractionRun;
  return diagnoseWholeAnswer(
    { expected: correct.result, expectedTrace: correct.trace },
    answer,
    (written) => searchSubtraction(problem, correct, written),
    { resultName: 'this difference' },
  );
}

/** Every rule, fact slip and pair that turns the problem into the written (wrong) answer. */
function searchSubtraction(
  problem: SubtractionProblem,
  correct: SubtractionRun,
  written: string,
): Candidate[] {
  const expected = correct.result;
  const matches: Candidate[] = [];
  const outcome = describeOutcome(problem.text, written);
  const { minuend, subtrahend } = problem;
  // Trial runs skip the trace; the working is drawn again only for the methods that match.
  const traced = (method: SubtractionMethod): SubtractionRun =>
    subtractColumns(minuend, subtrahend, method) as SubtractionRun;
  const singles: {
    rule: SubtractionRule;
    run: { result: string; fired: SubtractionRun['fired'] } | null;
  }[] = [];
  for (const rule of SUBTRACTION_RULES) {
    const trial = runSubtraction(minuend, subtrahend, rule.method, false);
    singles.push({ rule, run: trial });
    if (trial !== null && trial.result === written) {
      const run = traced(rule.method);
      matches.push({
        ids: [rule.id],
        explanation: `${rule.explain(problem, run)} ${outcome}`,
        trace: run.trace,
        facts: [],
      });
    }
  }

  const cells: FactCell<SubtractionColumn>[] = [];
  for (const c of correct.trace.columns)
    if (c.bottom !== null) cells.push({ position: c.index, value: c.written, data: c });
  const slip = findFactSlip(BigInt(written) - BigInt(expected), cells, (cell, w) =>
    wrongFacts('-', cell.data.used, cell.data.bottom ?? 0).includes(w),
  );
  if (slip !== null) {
    const fact = factError(slip.cell.data, slip.written);
    if (fact !== null) {
      matches.push({
        ids: ['sub.fact'],
        explanation: `${factSentence(fact)} The rest of the working is right, which gives ${written}.`,
        trace: null,
        facts: [fact],
      });
    }
  }

  for (let i = 0; i < singles.length; i += 1) {
    const a = singles[i] as (typeof singles)[number];
    if (a.run === null || a.run.result === written) continue;
    for (let j = i + 1; j < singles.length; j += 1) {
      const b = singles[j] as (typeof singles)[number];
      if (b.run === null || b.run.result === written || conflict(a.rule.method, b.rule.method))
        continue;
      const merged = { ...a.rule.method, ...b.rule.method };
      const trial = runSubtraction(minuend, subtrahend, merged, false);
      if (
        trial === null ||
        trial.result !== written ||
        trial.result === a.run.result ||
        trial.result === b.run.result
      )
        continue;
      const run = traced(merged);
      matches.push({
        ids: [a.rule.id, b.rule.id],
        explanation: `Two things happened together. ${a.rule.explain(problem, run)} ${b.rule.explain(problem, run)} ${outcome}`,
        trace: run.trace,
        facts: [],
      });
    }
  }
  // A rule with a slip ranks below every other kind of explanation: look for one only
  // when nothing simpler gives the answer (the first-ranked explanation is the same, and
  // the search, the costliest, is skipped).
  for (const { rule, run: trial } of matches.length > 0 ? [] : singles) {
    if (trial === null || trial.result === expected || trial.result === written) continue;
    const run = traced(rule.method);
    const found = slipsInRule(
      trial.result,
      written,
      slipSites(run),
      (slip) =>
        runSubtraction(minuend, subtrahend, { ...rule.method, slip }, false)?.result ?? null,
    );
    const best = found[0];
    if (best === undefined) continue;
    const withSlip = traced({ ...rule.method, slip: best.site.slip(best.written) });
    // The words tell what the child did: the rule as it worked with the slipped difference.
    if (!withSlip.fired.some((f) => f.part in rule.method)) continue;
    const fact = factOf(run, best.site.column, best.written);
    const slip = { column: best.site.column, fact };
    // Told in the order the child worked, column by column from the ones; lining up comes
    // before any column. A rule that works out the slipped column says it in one sentence;
    // a regrouping in that column comes before the slip made on the digits it left.
    const ruleWords = rule.explain(problem, withSlip, slip);
    const ruleAt = firstColumnOf(withSlip, rule.method);
    const story =
      rule.at?.(withSlip) === slip.column
        ? ruleWords
        : ruleAt <= slip.column
          ? `${ruleWords} ${factSentence(fact)}`
          : `${factSentence(fact)} ${ruleWords}`;
    matches.push({
      ids: [rule.id, 'sub.fact'],
      explanation: `Two things happened together. ${story} ${outcome}`,
      trace: withSlip.trace,
      facts: [fact],
      rank: best.rank,
    });
  }
  return matches;
}
