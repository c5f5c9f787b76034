import { diagnoseAddition } from '../addition/diagnoseAddition.js';
import type { Candidate, Findings } from '../diagnose/types.js';
import { diagnoseMultiplication } from '../multiplication/diagnoseMultiplication.js';
import { placeName, stripLeadingZeros } from '../numbers/digits.js';
import { formatDecimal } from '../parse/parseMeasured.js';
import type { Answer, DecimalNumber, Problem } from '../parse/types.js';
import { diagnoseSubtraction } from '../subtraction/diagnoseSubtraction.js';
import type { WorkingTrace } from '../trace/types.js';
import {
  decimalOfAnswer,
  decimalPlaceName,
  sameValue,
  scaleDecimal,
  unscaleDecimal,
} from './decimalNumbers.js';

type DecimalProblem = Extract<Problem, { kind: 'decimal' }>;

/** How the problem is worked as whole numbers: the point lined up (or, for ×, set aside). */
export interface ScaledDecimal {
  /** The whole-number problem the columns work, e.g. `'450 + 225'` for 4.5 + 2.25. */
  readonly text: string;
  readonly top: string;
  readonly bottom: string;
  /** Where the point goes in the result, counted from the right. */
  readonly places: number;
  /** Places money is written with (2), or 0. */
  readonly keep: number;
}

/** `scaledOf(4.5 + 2.25)` → `{ text: '450 + 225', places: 2, … }`. */
export function scaledOf(problem: DecimalProblem): ScaledDecimal {
  const keep = problem.money ? 2 : 0;
  const { left, right } = problem;
  if (problem.op === '×') {
    const top = stripLeadingZeros(left.whole + left.decimals);
    const bottom = stripLeadingZeros(right.whole + right.decimals);
    return {
      text: `${top} x ${bottom}`,
      top,
      bottom,
      places: left.decimals.length + right.decimals.length,
      keep,
    };
  }
  const places = Math.max(left.decimals.length, right.decimals.length);
  const top = scaleDecimal(left, places);
  const bottom = scaleDecimal(right, places);
  return { text: `${top} ${problem.op === '+' ? '+' : '-'} ${bottom}`, top, bottom, places, keep };
}

/** The ways of writing the point a child may use, each a rule of the catalog. */
export function pointRuleAnswers(problem: DecimalProblem): { id: string; answer: string }[] {
  const { left, right } = problem;
  const scaled = scaledOf(problem);
  const right0 = rightAnswerDigits(problem);
  const out: { id: string; answer: string }[] = [];
  const keep = scaled.keep;
  if (problem.op === '×') {
    if (left.decimals !== '' && right.decimals !== '')
      out.push({
        id: 'dec.point-as-in-addition',
        answer: unscaleDecimal(right0, Math.max(left.decimals.length, right.decimals.length), keep),
      });
  } else if (left.decimals.length !== right.decimals.length) {
    // Last digits lined up: the numbers worked as written, the point placed by the longer part.
    const a = BigInt(left.whole + left.decimals);
    const b = BigInt(right.whole + right.decimals);
    const worked = problem.op === '+' ? a + b : a - b;
    if (worked >= 0n)
      out.push({
        id: 'dec.right-aligned',
        answer: unscaleDecimal(worked.toString(), scaled.places, keep),
      });
  }
  const dropped = stripLeadingZeros(right0);
  if (scaled.places > 0) out.push({ id: 'dec.point-dropped', answer: dropped });
  return out;
}

/** The right result's digits, point set aside (places as in `scaledOf`). */
function rightAnswerDigits(problem: DecimalProblem): string {
  const { top, bottom } = scaledOf(problem);
  const a = BigInt(top);
  const b = BigInt(bottom);
  return (problem.op === '+' ? a + b : problem.op === '−' ? a - b : a * b).toString();
}

/** A column trace with the point drawn `places` from the right. */
function withPoint(trace: WorkingTrace | null, places: number): WorkingTrace | null {
  if (trace === null) return null;
  if (
    trace.kind === 'column-addition' ||
    trace.kind === 'column-subtraction' ||
    trace.kind === 'long-multiplication'
  )
    return { ...trace, point: places };
  return trace;
}

/**
 * Diagnoses decimals and money in `+ − ×`: the points are lined up (for ×, set aside and
 * counted back), the columns worked as whole numbers with every column rule under its own id
 * (`add.*`, `sub.*`, `mul.*`, one-off fact slips included), and the point rules of the catalog
 * (`dec.right-aligned`, `dec.point-dropped`, `dec.point-as-in-addition`) tried on the answer.
 * `diagnoseDecimal(parse('12.50 - 3.75'), read('19.85')).matches[0].ids` → `['sub.borrow-no-decrement']`.
 */
export function diagnoseDecimal(problem: DecimalProblem, answer: Answer): Findings {
  const scaled = scaledOf(problem);
  const expected = unscaleDecimal(rightAnswerDigits(problem), scaled.places, scaled.keep);
  const written = decimalOfAnswer(answer);
  // The child's answer on the same grid: lined up to the same places, when it fits on it.
  const onGrid =
    written !== null && written.decimals.length <= scaled.places
      ? scaleDecimal(written, scaled.places)
      : null;
  const wholeAnswer: Answer =
    onGrid === null
      ? { kind: 'fraction', whole: 0, numerator: 0, denominator: 1, text: answer.text }
      : { kind: 'whole', value: onGrid, text: onGrid };
  const base = findingsOfScaled(problem, scaled, wholeAnswer);
  const expectedTrace = withPoint(base.expectedTrace, scaled.places) as WorkingTrace;
  if (written !== null && sameValue(written, readDecimal(expected)))
    return { expected, expectedTrace, correct: true, matches: [], firstWrongStep: null, notes: [] };
  const relabel = relabeller(problem, scaled, expected, written);

  const matches: Candidate[] =
    onGrid === null
      ? []
      : base.matches.map((m) => ({
          ...m,
          explanation: relabel(m.explanation),
          trace: withPoint(m.trace, scaled.places),
          facts: m.facts.map((f) => ({ ...f, where: relabel(f.where) })),
        }));
  const point = written === null ? [] : pointMatches(problem, written, expected);
  const notes: string[] = [];
  if (written === null)
    notes.push(`The answer ${answer.text} is not a decimal; ${problem.text} is ${expected}.`);
  const firstWrongStep =
    point.length > 0 || onGrid === null
      ? {
          place: 'decimal point',
          expected,
          written: answer.text,
          note:
            point.length > 0
              ? 'The digits are worked, but the point stands in another place.'
              : 'The answer has more digits after the point than the working gives.',
        }
      : base.firstWrongStep === null
        ? null
        : {
            ...base.firstWrongStep,
            place: relabel(base.firstWrongStep.place),
            note: relabel(base.firstWrongStep.note),
          };
  return {
    expected,
    expectedTrace,
    correct: false,
    matches: [...point, ...matches],
    firstWrongStep,
    notes,
  };
}

function readDecimal(text: string): DecimalNumber {
  const [whole = '0', decimals = ''] = text.split('.');
  return { whole, decimals };
}

function findingsOfScaled(
  problem: DecimalProblem,
  scaled: ScaledDecimal,
  answer: Answer,
): Findings {
  if (problem.op === '+')
    return diagnoseAddition(
      { kind: 'addition', addends: [scaled.top, scaled.bottom], text: scaled.text },
      answer,
    );
  if (problem.op === '−')
    return diagnoseSubtraction(
      { kind: 'subtraction', minuend: scaled.top, subtrahend: scaled.bottom, text: scaled.text },
      answer,
    );
  return diagnoseMultiplication(
    { kind: 'multiplication', factors: [scaled.top, scaled.bottom], text: scaled.text },
    answer,
    undefined,
  );
}

const POINT_WORDS: Readonly<Record<string, string>> = {
  'dec.right-aligned':
    'The last digits were lined up instead of the points, the columns worked as whole numbers, and the point placed as many places from the right as the longer decimal part.',
  'dec.point-dropped': 'The digits are worked right, but no point was written.',
  'dec.point-as-in-addition':
    'The digits are multiplied right, but the point was placed as in addition (as many places as the factor with the most), not counting the places of both factors.',
};

function pointMatches(
  problem: DecimalProblem,
  written: DecimalNumber,
  expected: string,
): Candidate[] {
  return pointRuleAnswers(problem)
    .filter((r) => r.answer !== expected && sameValue(readDecimal(r.answer), written))
    .filter((r) => r.id !== 'dec.point-dropped' || written.decimals === '')
    .map((r) => ({
      ids: [r.id],
      explanation: `${POINT_WORDS[r.id] ?? ''} That gives ${r.answer} for ${problem.text}, which is ${expected}.`,
      // One point position cannot draw numbers lined up by their last digits: words only.
      trace: null,
      facts: [],
    }));
}

/**
 * Words about the whole-number working, rewritten for the decimals: the problem as written,
 * the numbers with their points, and the columns by their decimal names.
 */
function relabeller(
  problem: DecimalProblem,
  scaled: ScaledDecimal,
  expected: string,
  written: DecimalNumber | null,
): (text: string) => string {
  const numbers = new Map<string, string>();
  if (problem.op !== '×') {
    numbers.set(scaled.top, formatDecimal(problem.left));
    numbers.set(scaled.bottom, formatDecimal(problem.right));
  }
  numbers.set(rightAnswerDigits(problem), expected);
  if (written !== null && written.decimals.length <= scaled.places)
    numbers.set(scaleDecimal(written, scaled.places), formatDecimal(written));
  const { places, placePattern } = placeWords(scaled.places);
  return (text) =>
    text
      .split(scaled.text.replace('x', '×').replace('-', '−'))
      .join(problem.text)
      .split(scaled.text)
      .join(problem.text)
      .replace(/\b\d{2,}\b/g, (n) => (n.length > scaled.places ? (numbers.get(n) ?? n) : n))
      .replace(placePattern, (name) => places.get(name) ?? name);
}

const PLACE_WORDS = new Map<number, { places: Map<string, string>; placePattern: RegExp }>();

/** Whole-number column names → their names once the point stands `n` columns from the right. */
function placeWords(n: number): { places: Map<string, string>; placePattern: RegExp } {
  let words = PLACE_WORDS.get(n);
  if (words === undefined) {
    const places = new Map<string, string>();
    for (let k = 0; k < 32; k += 1) places.set(placeName(k), decimalPlaceName(k, n, placeName));
    const names = [...places.keys()].sort((a, b) => b.length - a.length);
    words = { places, placePattern: new RegExp(`\\b(${names.join('|')})\\b`, 'g') };
    PLACE_WORDS.set(n, words);
  }
  return words;
}
