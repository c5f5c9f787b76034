import type { Answer, Problem } from '../parse/types.js';
import type { AdditionColumn } from '../trace/types.js';
import { placeColumn, placeName } from '../numbers/digits.js';
import { describeOutcome } from '../diagnose/describeOutcome.js';
import { findFactSlip, type FactCell } from '../diagnose/findFactSlip.js';
import { slipsInRule, type SlipSite } from '../diagnose/slipsInRule.js';
import { wrongFacts } from '../diagnose/wrongFacts.js';
import { diagnoseWholeAnswer } from '../diagnose/diagnoseWholeAnswer.js';
import type { Candidate, FactError, Findings } from '../diagnose/types.js';
import { addColumns, type AdditionMethod, type AdditionRun } from './addColumns.js';

type AdditionProblem = Extract<Problem, { kind: 'addition' }>;

/** A basic-fact slip inside a rule's working: the sum of this column taken as the run shows it. */
interface AdditionSlip {
  readonly column: number;
  /** The column's parts as written in words, `'5 + 6 + 1 carried'`. */
  readonly parts: string;
}

interface AdditionRule {
  readonly id: string;
  readonly method: AdditionMethod;
  /**
   * The rule's words, worked on `run`. With a slip in the same working (`run` then carries
   * it), the column the rule speaks of tells the slipped sum, never the right one as if the
   * child had used it.
   */
  readonly explain: (problem: AdditionProblem, run: AdditionRun, slip?: AdditionSlip) => string;
  /** The column the rule's sentence opens on, when it speaks of one. */
  readonly at?: (run: AdditionRun) => number;
}

/** `columnParts(col)` → `'5 + 6 + 1 carried'`. */
const columnParts = (col: AdditionColumn): string =>
  `${col.digits.filter((d) => d !== null).join(' + ')}${col.carryIn > 0 ? ` + ${col.carryIn} carried` : ''}`;

/** The right sum of a column's parts (a slipped run keeps the slipped one in `sum`). */
const rightSum = (col: AdditionColumn): number =>
  col.digits.reduce<number>((s, d) => s + (d ?? 0), col.carryIn);

/**
 * How a rule's sentence opens on its column: `'In the ones column 5 + 6 + 1 carried = 12'`;
 * on the slipped column `'In the ones column 5 + 6 + 1 carried was taken as 13 instead of 12'`;
 * on another column with the same parts as the slipped one, `'… came out right, 12'`.
 */
function columnLead(col: AdditionColumn, slip: AdditionSlip | undefined): string {
  const parts = columnParts(col);
  const lead = `In the ${placeColumn(col.index)} ${parts}`;
  if (slip === undefined) return `${lead} = ${col.sum}`;
  if (slip.column === col.index)
    return `${lead} was taken as ${col.sum} instead of ${rightSum(col)}`;
  return slip.parts === parts ? `${lead} came out right, ${col.sum}` : `${lead} = ${col.sum}`;
}

const firstFired = (run: AdditionRun): AdditionColumn =>
  run.trace.columns[run.fired.find((f) => f.part === 'carry')?.column ?? 0] as AdditionColumn;

/** The addition rules of the catalog, each as a change to the column method. */
export const ADDITION_RULES: readonly AdditionRule[] = [
  {
    id: 'add.no-carry',
    method: { carry: 'drop' },
    at: (run) => firstFired(run).index,
    explain: (_p, run, slip) => {
      const col = firstFired(run);
      return `${columnLead(col, slip)}: the ${col.sum % 10} was written, but the ${Math.floor(col.sum / 10)} that belongs in the ${placeName(col.index + 1)} column was not carried.`;
    },
  },
  {
    id: 'add.carry-written',
    method: { carry: 'write-sum' },
    at: (run) => firstFired(run).index,
    explain: (_p, run, slip) => {
      const col = firstFired(run);
      return `${columnLead(col, slip)}, and the whole ${col.sum} was written under that column instead of writing ${col.sum % 10} and carrying ${Math.floor(col.sum / 10)} to the ${placeName(col.index + 1)} column.`;
    },
  },
  {
    id: 'add.carry-reversed',
    method: { carry: 'reverse' },
    at: (run) => firstFired(run).index,
    explain: (_p, run, slip) => {
      const col = firstFired(run);
      return `${columnLead(col, slip)}: the ${Math.floor(col.sum / 10)} was written and the ${col.sum % 10} carried, the other way round from writing ${col.sum % 10} and carrying ${Math.floor(col.sum / 10)}.`;
    },
  },
  {
    id: 'add.left-aligned',
    method: { align: 'left' },
    explain: (_p, run) => {
      const shifted = run.trace.rows.filter((r) => r.shift > 0);
      const first = shifted[0];
      if (first === undefined) return 'The numbers were lined up on the left.';
      return `${first.digits} was lined up on the left, under the first digits of the longer number (as if it were ${first.digits}${'0'.repeat(first.shift)}), instead of lining up the ones digits on the right.`;
    },
  },
  {
    id: 'add.writes-carry',
    method: { carry: 'write-carry' },
    at: (run) => firstFired(run).index,
    explain: (_p, run, slip) => {
      const col = firstFired(run);
      return `${columnLead(col, slip)}: the carried ${Math.floor(col.sum / 10)} was written in that column and nothing was carried, instead of writing ${col.sum % 10} and carrying ${Math.floor(col.sum / 10)}.`;
    },
  },
];

const keysOf = (m: AdditionMethod): string[] => Object.keys(m);

/** The fact a column uses: its digits and any carry, as `a + b`. */
function columnFact(col: AdditionColumn): { a: number; b: number } | null {
  const parts = col.digits.filter((d): d is number => d !== null);
  if (col.carryIn > 0) parts.push(col.carryIn);
  if (parts.length < 2) return null;
  const b = parts[parts.length - 1] as number;
  return { a: col.sum - b, b };
}

function factError(col: AdditionColumn, written: number): FactError | null {
  const fact = columnFact(col);
  if (fact === null) return null;
  return {
    op: '+',
    a: fact.a,
    b: fact.b,
    expected: col.sum,
    written,
    where: placeColumn(col.index),
  };
}

/** `'In the ones column 5 + 6 + 1 carried was taken as 13 instead of 12.'` */
const factSentence = (col: AdditionColumn, f: FactError): string =>
  `${columnLead({ ...col, sum: f.written }, { column: col.index, parts: columnParts(col) })}.`;

/** Every column fact of a run where a slip could sit, at the place its digits are written. */
function slipSites(
  run: AdditionRun,
): (SlipSite<NonNullable<AdditionMethod['slip']>> & { column: number })[] {
  const sites: (SlipSite<NonNullable<AdditionMethod['slip']>> & { column: number })[] = [];
  let position = 0;
  for (const col of run.trace.columns) {
    const fact = columnFact(col);
    if (fact !== null) {
      sites.push({
        column: col.index,
        position,
        right: fact.a + fact.b,
        wrong: wrongFacts('+', fact.a, fact.b),
        slip: (sum) => ({ column: col.index, sum }),
      });
    }
    position += col.written.length;
  }
  return sites;
}

/**
 * Diagnoses a column addition: the correct working, every rule (and pair) that
 * reproduces the answer, and the first column that differs.
 * `diagnoseAddition(parse('58 + 67'), whole('115')).matches[0].ids` → `['add.no-carry']`.
 */
export function diagnoseAddition(problem: AdditionProblem, answer: Answer): Findings {
  const correct = addColumns(problem.addends);
  return diagnoseWholeAnswer(
    { expected: correct.result, expectedTrace: correct.trace },
    answer,
    (written) => searchAddition(problem, correct, written),
    { resultName: 'this sum' },
  );
}

/** Every rule, fact slip and pair that turns the problem into the written (wrong) answer. */
function searchAddition(
  problem: AdditionProblem,
  correct: AdditionRun,
  written: string,
): Candidate[] {
  const expected = correct.result;
  const matches: Candidate[] = [];
  const outcome = describeOutcome(problem.text, written);
  const singles = ADDITION_RULES.map((rule) => ({
    rule,
    run: addColumns(problem.addends, rule.method),
  }));
  for (const { rule, run } of singles) {
    if (run.result === written && run.result !== expected) {
      matches.push({
        ids: [rule.id],
        explanation: `${rule.explain(problem, run)} ${outcome}`,
        trace: run.trace,
        facts: [],
      });
    }
  }

  const cells: FactCell<AdditionColumn>[] = [];
  for (const col of correct.trace.columns) {
    if (columnFact(col) !== null) cells.push({ position: col.index, value: col.sum, data: col });
  }
  const slip = findFactSlip(BigInt(written) - BigInt(expected), cells, (cell, w) => {
    const fact = columnFact(cell.data);
    return fact !== null && wrongFacts('+', fact.a, fact.b).includes(w);
  });
  if (slip !== null) {
    const fact = factError(slip.cell.data, slip.written);
    if (fact !== null) {
      matches.push({
        ids: ['add.fact'],
        explanation: `${factSentence(slip.cell.data, fact)} The rest of the working is right, which gives ${written}.`,
        trace: null,
        facts: [fact],
      });
    }
  }

  for (let i = 0; i < singles.length; i += 1) {
    for (let j = i + 1; j < singles.length; j += 1) {
      const a = singles[i] as (typeof singles)[number];
      const b = singles[j] as (typeof singles)[number];
      if (keysOf(a.rule.method).some((key) => keysOf(b.rule.method).includes(key))) continue;
      if (a.run.result === written || b.run.result === written) continue;
      const run = addColumns(problem.addends, { ...a.rule.method, ...b.rule.method });
      if (run.result !== written || run.result === a.run.result || run.result === b.run.result)
        continue;
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
  for (const { rule, run } of matches.length > 0 ? [] : singles) {
    if (run.result === expected || run.result === written) continue;
    const method = rule.method;
    const found = slipsInRule(
      run.result,
      written,
      slipSites(run),
      (slip) => addColumns(problem.addends, { ...method, slip }).result,
    );
    const best = found[0];
    if (best === undefined) continue;
    const slipped = addColumns(problem.addends, { ...method, slip: best.site.slip(best.written) });
    // The words tell what the child did: the rule as it worked on the slipped sum.
    if (!slipped.fired.some((f) => f.part in method)) continue;
    const col = slipped.trace.columns[best.site.column] as AdditionColumn;
    const fact = factError({ ...col, sum: rightSum(col) }, best.written);
    if (fact === null) continue;
    const ruleWords = rule.explain(problem, slipped, {
      column: col.index,
      parts: columnParts(col),
    });
    // Told in the order the child worked, column by column from the ones; on the same column,
    // one sentence: the slipped sum, then what the rule did with it ("… was taken as 12
    // instead of 11: the 2 was written, but …"). Lining up comes before any adding.
    const slipWords = factSentence(col, fact);
    const at = rule.at?.(slipped) ?? -1;
    const story =
      at === col.index
        ? ruleWords
        : at < col.index
          ? `${ruleWords} ${slipWords}`
          : `${slipWords} ${ruleWords}`;
    matches.push({
      ids: [rule.id, 'add.fact'],
      explanation: `Two things happened together. ${story} ${outcome}`,
      trace: slipped.trace,
      facts: [fact],
      rank: best.rank,
    });
  }
  return matches;
}
