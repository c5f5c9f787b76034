import { describeOutcome } from '../diagnose/describeOutcome.js';
import { findFactSlip, type FactCell } from '../diagnose/findFactSlip.js';
import { slipsInRule, type SlipSite } from '../diagnose/slipsInRule.js';
import { wrongProducts } from '../diagnose/wrongFacts.js';
import { firstWrongColumn } from '../diagnose/firstWrongColumn.js';
import type {
  Candidate,
  FactError,
  Findings,
  FirstWrongStep,
  WrittenSteps,
} from '../diagnose/types.js';
import { placeName, stripLeadingZeros, trailingZeros } from '../numbers/digits.js';
import type { Answer, Problem } from '../parse/types.js';
import type { LongMultiplicationTrace, PartialProduct, ProductCell } from '../trace/types.js';
import { checkPartials } from './checkPartials.js';
import { multiplyLong, type MultiplicationMethod, type MultiplicationRun } from './multiplyLong.js';
import { multiplyWithZerosSetAside } from './multiplyWithZerosSetAside.js';

type MultiplicationProblem = Extract<Problem, { kind: 'multiplication' }>;

/**
 * The written layout: the first factor on top, unless it is shorter than the second, when
 * the longer number goes on top (common practice, no source).
 * `layoutOf(['4', '27'])` → `{ top: '27', bottom: '4' }`.
 */
export function layoutOf(factors: readonly [string, string]): { top: string; bottom: string } {
  const [a, b] = factors;
  return a.length < b.length ? { top: b, bottom: a } : { top: a, bottom: b };
}

/** A basic-fact slip inside a rule's working: the cell (partial product, column) and the fact as taken. */
interface ProductSlip {
  readonly partial: number;
  readonly column: number;
  readonly fact: FactError;
}

interface MethodRule {
  readonly id: string;
  readonly method: MultiplicationMethod;
  /**
   * The rule's words, worked on `run`. With a slip in the same working (`run` then carries
   * it), the cell the rule speaks of tells the slipped product, never the right one as if the
   * child had used it.
   */
  readonly explain: (run: MultiplicationRun, slip?: ProductSlip) => string;
  /** The part of the method whose first cell the rule's sentence speaks of (none: the placeholder, which acts once the products are made). */
  readonly part?: keyof MultiplicationMethod;
}

const firstCell = (
  run: MultiplicationRun,
  part: keyof MultiplicationMethod,
): { p: PartialProduct; c: ProductCell } => {
  const f = run.fired.find((x) => x.part === part) ?? { partial: 0, column: 0 };
  const p = run.trace.partials[f.partial] as PartialProduct;
  return { p, c: p.cells[f.column] as ProductCell };
};

const where = (c: ProductCell): string => `the ${placeName(c.index)} digit`;

/**
 * How a rule's sentence opens on its cell: `'At the ones digit 9 × 4 = 36'`; on the slipped
 * cell `'At the ones digit 9 × 4 was taken as 35 instead of 36'`; on another cell where the
 * slipped fact came out right, `'At the tens digit 9 × 4 came out right, 36'`.
 */
function cellLead(
  run: MultiplicationRun,
  part: keyof MultiplicationMethod,
  slip: ProductSlip | undefined,
): string {
  const f = run.fired.find((x) => x.part === part) ?? { partial: 0, column: 0 };
  const { c } = firstCell(run, part);
  const fact = `${c.topDigit} × ${c.multiplierDigit}`;
  const lead = `At ${where(c)} ${fact}`;
  if (slip === undefined) return `${lead} = ${c.product}`;
  if (slip.partial === f.partial && slip.column === f.column)
    return `${lead} was taken as ${c.product} instead of ${c.topDigit * c.multiplierDigit}`;
  return slip.fact.a === c.topDigit && slip.fact.b === c.multiplierDigit
    ? `${lead} came out right, ${c.product}`
    : `${lead} = ${c.product}`;
}

/** The multiplication rules that change the long-multiplication method itself. */
export const MULTIPLICATION_METHOD_RULES: readonly MethodRule[] = [
  {
    id: 'mul.carry-before-multiplying',
    method: { carry: 'before' },
    part: 'carry',
    explain: (run, slip) => {
      const f = run.fired.find((x) => x.part === 'carry') ?? { partial: 0, column: 0 };
      const { c } = firstCell(run, 'carry');
      const t = c.topDigit;
      const m = c.multiplierDigit;
      const here = slip !== undefined && slip.partial === f.partial && slip.column === f.column;
      const made = here
        ? `making (${t} + ${c.carryIn}) × ${m}, and ${t + c.carryIn} × ${m} was taken as ${c.product} instead of ${(t + c.carryIn) * m}`
        : `making (${t} + ${c.carryIn}) × ${m} = ${c.product}`;
      const usual =
        slip !== undefined && slip.fact.a === t && slip.fact.b === m
          ? `${t} × ${m}`
          : `${t} × ${m} = ${t * m}`;
      return here
        ? `At ${where(c)} the carried ${c.carryIn} was added to the ${t} before multiplying, ${made} (the usual working is ${usual}, then adding the ${c.carryIn}).`
        : `At ${where(c)} the carried ${c.carryIn} was added to the ${t} before multiplying, ${made}, instead of ${usual} and then adding the ${c.carryIn}.`;
    },
  },
  {
    id: 'mul.no-carry',
    method: { carry: 'drop' },
    part: 'carry',
    explain: (run, slip) => {
      const { c } = firstCell(run, 'carry');
      return `${cellLead(run, 'carry', slip)}: the ${c.product % 10} was written, but the ${Math.floor(c.product / 10)} was not carried to the next digit.`;
    },
  },
  {
    id: 'mul.carry-written',
    method: { carry: 'write' },
    part: 'carry',
    explain: (run, slip) => {
      const { c } = firstCell(run, 'carry');
      return `${cellLead(run, 'carry', slip)}, and the whole ${c.product} was written, side by side with the other products, instead of writing ${c.product % 10} and carrying ${Math.floor(c.product / 10)}.`;
    },
  },
  {
    id: 'mul.carry-reversed',
    method: { carry: 'reverse' },
    part: 'carry',
    explain: (run, slip) => {
      const { c } = firstCell(run, 'carry');
      const total = c.product + c.carryIn;
      const lead = cellLead(run, 'carry', slip);
      return `${c.carryIn > 0 ? `${lead}, and ${c.product} + ${c.carryIn} = ${total}` : lead}: the ${Math.floor(total / 10)} was written and the ${total % 10} carried, the other way round from writing ${total % 10} and carrying ${Math.floor(total / 10)}.`;
    },
  },
  {
    id: 'mul.zero-times-n-is-n',
    method: { zeroDigit: 'n' },
    part: 'zeroDigit',
    explain: (run) => {
      const { c } = firstCell(run, 'zeroDigit');
      const n = c.topDigit === 0 ? c.multiplierDigit : c.topDigit;
      return `At ${where(c)} ${c.topDigit} × ${c.multiplierDigit} was taken as ${n}; any number times 0 is 0.`;
    },
  },
  {
    id: 'mul.no-placeholder',
    method: { placeholder: 'none' },
    explain: (run) => {
      const f = run.fired.find((x) => x.part === 'placeholder');
      const p = run.trace.partials[f?.partial ?? 1] as PartialProduct;
      return `The partial product ${p.digits} (for the ${placeName(p.multiplierIndex)} digit ${p.multiplierDigit}) was not moved ${p.multiplierIndex === 1 ? 'one place' : `${p.multiplierIndex} places`} to the left, so it was added as ${p.digits} instead of ${p.digits}${'0'.repeat(p.multiplierIndex)}.`;
    },
  },
];

const conflict = (a: MultiplicationMethod, b: MultiplicationMethod): boolean =>
  Object.keys(a).some((key) => key in b);

/** The fact worked out in a cell (`factor` is the top digit, or top digit plus carry when added first), written as `written`. */
function cellFact(
  c: ProductCell,
  factor: number,
  written: number,
  top: string,
  bottom: string,
  p: PartialProduct,
): FactError {
  return {
    op: 'x',
    a: factor,
    b: c.multiplierDigit,
    expected: factor * c.multiplierDigit,
    written,
    where: `${
      top.length === 1 && bottom.length === 1
        ? 'the basic fact'
        : bottom.length === 1
          ? `${placeName(c.index)} digit of ${top}`
          : `${placeName(c.index)} digit of ${top} times the ${placeName(p.multiplierIndex)} digit of ${bottom}`
    }${factor === c.topDigit ? '' : `, the ${c.topDigit} with the carried ${factor - c.topDigit} added first`}`,
  };
}

/** Every product a run works out where a slip could sit, at the place its digits are written. */
function slipSites(
  run: MultiplicationRun,
  method: MultiplicationMethod,
): (SlipSite<NonNullable<MultiplicationMethod['slip']>> & {
  partial: number;
  column: number;
  factor: number;
})[] {
  const sites: (SlipSite<NonNullable<MultiplicationMethod['slip']>> & {
    partial: number;
    column: number;
    factor: number;
  })[] = [];
  run.trace.partials.forEach((p, j) => {
    let position = p.shift;
    p.cells.forEach((c, i) => {
      const rote = run.fired.some(
        (f) => f.partial === j && f.column === i && f.part === 'zeroDigit',
      );
      const before = method.carry === 'before';
      const factor = before ? c.topDigit + c.carryIn : c.topDigit;
      // A top digit made 10 or more by adding the carry first is no longer a basic fact.
      if (!rote && factor <= 9) {
        sites.push({
          partial: j,
          column: i,
          factor,
          position,
          right: factor * c.multiplierDigit,
          // The same list as the single-fact check: a carry added after multiplying and then
          // left out is not a wrong fact.
          wrong: wrongProducts(factor, c.multiplierDigit, before ? 0 : c.carryIn),
          slip: (product) => ({ partial: j, column: i, product }),
        });
      }
      position += c.written.length;
    });
  });
  return sites;
}

const factSentence = (f: FactError): string =>
  `${f.a} × ${f.b} was taken as ${f.written} instead of ${f.expected} (${f.where}).`;

const sameNumber = (a: string, b: string): boolean => stripLeadingZeros(a.replace(/,/g, '')) === b;

/** Whether the child's written partial products are those of a run. */
function partialsAgree(trace: LongMultiplicationTrace, written: readonly string[]): boolean {
  if (written.length !== trace.partials.length) return false;
  return trace.partials.every((p, i) => {
    const w = written[i] as string;
    return sameNumber(w, p.value);
  });
}

/**
 * Diagnoses a long multiplication: the correct working, every rule (and pair) that
 * reproduces the answer (and the written partial products, when given), and the first
 * partial product or column that differs.
 * `diagnoseMultiplication(parse('27 x 4'), whole('168')).matches[0].ids` → `['mul.carry-before-multiplying']`.
 */
export function diagnoseMultiplication(
  problem: MultiplicationProblem,
  answer: Answer,
  steps: WrittenSteps | undefined,
): Findings {
  const { top, bottom } = layoutOf(problem.factors);
  const correct = multiplyLong(top, bottom);
  const expected = correct.result;
  const partials = steps?.partials;
  const writtenSteps =
    partials === undefined ? null : checkPartials(top, bottom, correct, partials);
  const base = { expected, expectedTrace: correct.trace, writtenSteps };
  if (answer.kind !== 'whole') {
    return {
      ...base,
      correct: false,
      matches: [],
      firstWrongStep: null,
      notes: [`The answer ${answer.text} is not a whole number; this product is ${expected}.`],
    };
  }
  const written = answer.value;
  const notes: string[] = [];
  if (partials !== undefined && partials.length < correct.trace.partials.length) {
    notes.push(
      `The written steps have ${partials.length} partial product${partials.length === 1 ? '' : 's'}; ${bottom} has ${correct.trace.partials.length} digits, so one partial product each is expected.`,
    );
  }
  const stepsFit = (trace: LongMultiplicationTrace): boolean =>
    partials === undefined || partialsAgree(trace, partials);
  const firstWrong = firstWrongStepOf(correct.trace, partials, expected, written);
  if (written === expected)
    return { ...base, correct: true, matches: [], firstWrongStep: null, notes };

  const outcome = describeOutcome(problem.text, written);
  const matches: Candidate[] = [];
  // Trial runs add the partial products as numbers; a run that matches is drawn again whole.
  const trial = (method: MultiplicationMethod): MultiplicationRun =>
    multiplyLong(top, bottom, method, false);
  const singles = MULTIPLICATION_METHOD_RULES.map((rule) => ({ rule, run: trial(rule.method) }));
  for (const { rule, run } of singles) {
    if (run.result === written && stepsFit(run.trace)) {
      matches.push({
        ids: [rule.id],
        explanation: `${rule.explain(run)} ${outcome}`,
        trace: multiplyLong(top, bottom, rule.method).trace,
        facts: [],
      });
    }
  }
  const zt = trailingZeros(top);
  const zb = trailingZeros(bottom);
  if (zt + zb > 0) {
    for (const appended of new Set([zt, zb])) {
      if (appended === zt + zb) continue;
      const run = multiplyWithZerosSetAside(top, bottom, appended);
      if (
        run !== null &&
        run.result === written &&
        run.result !== expected &&
        stepsFit(run.trace)
      ) {
        matches.push({
          ids: ['mul.zeros-dropped'],
          explanation: `The zeros were set aside and ${top.slice(0, top.length - zt)} × ${bottom.slice(0, bottom.length - zb)} worked out; then ${appended === 0 ? 'no zeros were' : appended === 1 ? 'only 1 zero was' : `only ${appended} zeros were`} put back, though ${top} and ${bottom} end in ${zt + zb} zeros between them. ${outcome}`,
          trace: run.trace,
          facts: [],
        });
      }
    }
    const extra = multiplyWithZerosSetAside(top, bottom, zt + zb + 1);
    if (extra !== null && extra.result === written && stepsFit(extra.trace)) {
      matches.push({
        ids: ['mul.zeros-extra'],
        explanation: `The zeros were set aside and the rest multiplied; then ${zt + zb + 1} zeros were put back, one more than the ${zt + zb} that ${top} and ${bottom} end in. ${outcome}`,
        trace: extra.trace,
        facts: [],
      });
    }
  }
  if (
    partials !== undefined &&
    correct.trace.partials.length > 1 &&
    partialsAgree(correct.trace, partials)
  ) {
    const sumSlip = firstWrongColumn(expected, written);
    matches.push({
      ids: ['mul.partials-added-wrong'],
      explanation: `Every partial product is right (${correct.trace.partials.map((p) => p.value).join(' and ')}), but adding them gave ${written} instead of ${expected}${sumSlip === null ? '' : `; the ${sumSlip.place} column of the sum is where it first differs`}.`,
      trace: null,
      facts: [],
    });
  }

  const cells: FactCell<{ p: PartialProduct; c: ProductCell }>[] = [];
  for (const p of correct.trace.partials) {
    for (const c of p.cells)
      cells.push({ position: c.index + p.multiplierIndex, value: c.product, data: { p, c } });
  }
  // With written partial products, the slip must sit in the partial product that shows it.
  const slip = findFactSlip(
    BigInt(written) - BigInt(expected),
    cells,
    (cell, w) =>
      // Short by exactly the carry is a carry not added, not a fact to practise.
      wrongProducts(
        cell.data.c.topDigit,
        cell.data.c.multiplierDigit,
        cell.data.c.carryIn,
      ).includes(w) &&
      (partials === undefined ||
        partialsAgree(
          multiplyLong(top, bottom, {
            slip: { partial: cell.data.p.multiplierIndex, column: cell.data.c.index, product: w },
          }).trace,
          partials,
        )),
  );
  if (slip !== null) {
    const { p, c } = slip.cell.data;
    const fact = cellFact(c, c.topDigit, slip.written, top, bottom, p);
    matches.push({
      ids: ['mul.fact'],
      explanation: `${factSentence(fact)} The rest of the working is right, which gives ${written}.`,
      trace: null,
      facts: [fact],
    });
  }

  for (let i = 0; i < singles.length; i += 1) {
    const a = singles[i] as (typeof singles)[number];
    if (a.run.result === written || a.run.result === expected) continue;
    for (let j = i + 1; j < singles.length; j += 1) {
      const b = singles[j] as (typeof singles)[number];
      if (b.run.result === written || conflict(a.rule.method, b.rule.method)) continue;
      const run = trial({ ...a.rule.method, ...b.rule.method });
      if (
        run.result !== written ||
        run.result === a.run.result ||
        run.result === b.run.result ||
        !stepsFit(run.trace)
      )
        continue;
      matches.push({
        ids: [a.rule.id, b.rule.id],
        explanation: `Two things happened together. ${a.rule.explain(run)} ${b.rule.explain(run)} ${outcome}`,
        trace: multiplyLong(top, bottom, { ...a.rule.method, ...b.rule.method }).trace,
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
    const found = slipsInRule(run.result, written, slipSites(run, method), (slip) => {
      const r = trial({ ...method, slip });
      return stepsFit(r.trace) ? r.result : null;
    });
    const best = found[0];
    if (best === undefined) continue;
    const slipped = multiplyLong(top, bottom, { ...method, slip: best.site.slip(best.written) });
    // The words tell what the child did: the rule as it worked on the slipped product.
    if (!slipped.fired.some((f) => f.part in method)) continue;
    const p = run.trace.partials[best.site.partial] as PartialProduct;
    const c = p.cells[best.site.column] as ProductCell;
    const fact = cellFact(c, best.site.factor, best.written, top, bottom, p);
    const slip = { partial: best.site.partial, column: best.site.column, fact };
    // Told in the order the child worked, cell by cell; on the same cell, one sentence: the
    // slipped fact, then what the rule did with it ("9 × 4 was taken as 35 instead of 36: the
    // 5 was written, but …"). Written without its placeholder, a partial product is added once
    // its products are made: the slip comes first.
    const ruleWords = rule.explain(slipped, slip);
    const at =
      rule.part === undefined ? undefined : slipped.fired.find((f) => f.part === rule.part);
    const story =
      at === undefined
        ? `${factSentence(fact)} ${ruleWords}`
        : at.partial === slip.partial && at.column === slip.column
          ? ruleWords
          : at.partial < slip.partial || (at.partial === slip.partial && at.column < slip.column)
            ? `${ruleWords} ${factSentence(fact)}`
            : `${factSentence(fact)} ${ruleWords}`;
    matches.push({
      ids: [rule.id, 'mul.fact'],
      explanation: `Two things happened together. ${story} ${outcome}`,
      trace: slipped.trace,
      facts: [fact],
      rank: best.rank,
    });
  }
  return { ...base, correct: false, matches, firstWrongStep: firstWrong, notes };
}

function firstWrongStepOf(
  trace: LongMultiplicationTrace,
  partials: readonly string[] | undefined,
  expected: string,
  written: string,
): FirstWrongStep | null {
  if (partials !== undefined) {
    for (let i = 0; i < trace.partials.length; i += 1) {
      const p = trace.partials[i] as PartialProduct;
      const w = partials[i];
      if (w !== undefined && sameNumber(w, p.value)) continue;
      const label = `partial product ${i + 1}`;
      return {
        place: label,
        expected: p.value,
        written: w === undefined ? '' : stripLeadingZeros(w.replace(/,/g, '')),
        note: `${trace.top} × ${p.multiplierDigit} (the ${placeName(i)} digit of ${trace.bottom}) gives ${p.digits}${p.shift > 0 ? `, written ${p.shift === 1 ? 'one place' : `${p.shift} places`} to the left as ${p.value}` : ''}; the written step has ${w ?? 'nothing'}.`,
      };
    }
  }
  return firstWrongColumn(expected, written);
}
