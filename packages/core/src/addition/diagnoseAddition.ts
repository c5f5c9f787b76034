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

interface AdditionRule {
  readonly id: string;
  readonly method: AdditionMethod;
  readonly explain: (problem: AdditionProblem, run: AdditionRun) => string;
}

/** `columnSum(col)` → `'5 + 6 + 1 carried = 12'`. */
const columnSum = (col: AdditionColumn): string =>
  `${col.digits.filter((d) => d !== null).join(' + ')}${col.carryIn > 0 ? ` + ${col.carryIn} carried` : ''} = ${col.sum}`;

const firstFired = (run: AdditionRun): AdditionColumn =>
  run.trace.columns[run.fired.find((f) => f.part === 'carry')?.column ?? 0] as AdditionColumn;

/** The addition rules of the catalog, each as a change to the column method. */
export const ADDITION_RULES: readonly AdditionRule[] = [
  {
    id: 'add.no-carry',
    method: { carry: 'drop' },
    explain: (_p, run) => {
      const col = firstFired(run);
      return `In the ${placeColumn(col.index)} ${columnSum(col)}: the ${col.sum % 10} was written, but the ${Math.floor(col.sum / 10)} that belongs in the ${placeName(col.index + 1)} column was not carried.`;
    },
  },
  {
    id: 'add.carry-written',
    method: { carry: 'write-sum' },
    explain: (_p, run) => {
      const col = firstFired(run);
      return `In the ${placeColumn(col.index)} ${columnSum(col)}, and the whole ${col.sum} was written under that column instead of writing ${col.sum % 10} and carrying ${Math.floor(col.sum / 10)} to the ${placeName(col.index + 1)} column.`;
    },
  },
  {
    id: 'add.carry-reversed',
    method: { carry: 'reverse' },
    explain: (_p, run) => {
      const col = firstFired(run);
      return `In the ${placeColumn(col.index)} ${columnSum(col)}: the ${Math.floor(col.sum / 10)} was written and the ${col.sum % 10} carried, the other way round from writing ${col.sum % 10} and carrying ${Math.floor(col.sum / 10)}.`;
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
    explain: (_p, run) => {
      const col = firstFired(run);
      return `In the ${placeColumn(col.index)} ${columnSum(col)}: the carried ${Math.floor(col.sum / 10)} was written in that column and nothing was carried, instead of writing ${col.sum % 10} and carrying ${Math.floor(col.sum / 10)}.`;
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

const factSentence = (f: FactError): string =>
  `In the ${f.where} ${f.a} + ${f.b} was taken as ${f.written} instead of ${f.expected}.`;

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
        explanation: `${factSentence(fact)} The rest of the working is right, which gives ${written}.`,
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
    const col = run.trace.columns[best.site.column] as AdditionColumn;
    const fact = factError(col, best.written);
    if (fact === null) continue;
    matches.push({
      ids: [rule.id, 'add.fact'],
      explanation: `Two things happened together. ${rule.explain(problem, run)} ${factSentence(fact)} ${outcome}`,
      trace: slipped.trace,
      facts: [fact],
      rank: best.rank,
    });
  }
  return matches;
}
