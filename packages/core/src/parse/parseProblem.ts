import { compareWhole } from '../numbers/digits.js';
import { formatExpression, formatFraction } from './formatProblem.js';
import { parseMeasured } from './parseMeasured.js';
import { graphemeAt } from './graphemeAt.js';
import { quoteInput } from './quoteInput.js';
import { MAX_DIGITS, readWhole } from './readWhole.js';
import type { Fraction, Operation, ParsedProblem, ReadError, RoundingPlace } from './types.js';

type Token =
  | { t: 'num'; text: string; at: number }
  | { t: 'op'; op: Operation; text: string; at: number }
  | { t: 'slash'; text: string; at: number }
  | { t: 'blank'; text: string; at: number }
  | { t: 'eq'; text: string; at: number };

type Term = { t: 'num'; value: string; at: number } | { t: 'blank'; at: number };

const OPS: Readonly<Record<string, Operation>> = {
  '+': '+',
  '-': '−',
  '−': '−',
  '–': '−',
  x: '×',
  X: '×',
  '×': '×',
  '*': '×',
  '÷': '÷',
};

const PLACES: Readonly<Record<string, number>> = {
  ten: 1,
  hundred: 2,
  thousand: 3,
  'ten thousand': 4,
  'hundred thousand': 5,
  million: 6,
};

/** Longest dividend or divisor for long division (keeps every step an exact JS number). */
const MAX_DIVISION_DIGITS = 15;
/** Largest numerator or denominator Workback reads in a fraction. */
const MAX_FRACTION_PART = 999_999;

const fail = (message: string, at?: number): ParsedProblem => ({
  ok: false,
  error: at === undefined ? { message } : { message, at },
});

/**
 * Reads a problem typed the way it is written on the page. Never guesses: anything it
 * cannot read comes back as an error naming the part it did not understand.
 *
 * `parseProblem('304 - 75')` → `{ ok: true, problem: { kind: 'subtraction', minuend: '304',
 * subtrahend: '75', text: '304 − 75' } }`;
 * `parseProblem('304 $ 75')` → `{ ok: false, error: { message: 'I could not read “$” …', at: 4 } }`.
 */
export function parseProblem(text: string): ParsedProblem {
  const trimmed = text.trim();
  if (trimmed === '') return fail('Type a problem, for example 304 − 75.');
  if (/^round\b/i.test(trimmed)) return parseRounding(trimmed, text.indexOf(trimmed));
  const measured = parseMeasured(trimmed);
  if (measured !== null) return measured;

  const tokens = tokenize(text);
  if (!Array.isArray(tokens)) return { ok: false, error: tokens };
  if (tokens.length === 0) return fail('Type a problem, for example 304 − 75.');

  if (tokens.some((tk) => tk.t === 'slash')) {
    const asFractions = parseFractions(tokens);
    if (asFractions !== null) return asFractions;
  }

  const eqs = tokens.filter((tk) => tk.t === 'eq');
  if (eqs.length > 1)
    return fail('There is more than one “=”; Workback checks one equation at a time.', eqs[1]?.at);
  if (eqs.length === 1) {
    const eqIndex = tokens.findIndex((tk) => tk.t === 'eq');
    const left = tokens.slice(0, eqIndex);
    const right = tokens.slice(eqIndex + 1);
    if (left.length === 0) return fail('Nothing comes before the “=”.', tokens[eqIndex]?.at);
    if (right.length === 0) return parseExpression(left, true);
    return parseEquation(left, right, tokens[eqIndex]?.at ?? 0);
  }
  return parseExpression(tokens, true);
}

/** The word (letters, with inner hyphens or apostrophes) that starts at `i`: `'forty-three'`. */
const wordAt = (text: string, i: number): string =>
  /^\p{L}+(?:[-'’]\p{L}+)*/u.exec(text.slice(i))?.[0] ?? graphemeAt(text, i);

function tokenize(text: string): Token[] | ReadError {
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    const ch = text[i] ?? '';
    if (/\s/.test(ch)) {
      i += 1;
      continue;
    }
    if (/\d/.test(ch)) {
      const m = /^\d[\d,]*(\.\d*)?/.exec(text.slice(i));
      const raw = (m?.[0] ?? ch).replace(/,+$/, '');
      if (raw.includes('.')) {
        return {
          message: `${quoteInput(raw)} is a decimal; Workback checks decimals in a +, − or × of two numbers (4.5 + 2.25) and comparisons (0.45 ? 0.5).`,
          at: i,
        };
      }
      tokens.push({ t: 'num', text: raw, at: i });
      i += raw.length;
      continue;
    }
    const op = OPS[ch];
    if (op !== undefined) {
      if ((ch === 'x' || ch === 'X') && /\p{L}/u.test(text[i + 1] ?? '')) {
        return { message: `I could not read the word ${quoteInput(wordAt(text, i))}.`, at: i };
      }
      tokens.push({ t: 'op', op, text: ch, at: i });
      i += 1;
      continue;
    }
    if (ch === '/') tokens.push({ t: 'slash', text: ch, at: i });
    else if (ch === '?' || ch === '_') tokens.push({ t: 'blank', text: ch, at: i });
    else if (ch === '=') tokens.push({ t: 'eq', text: ch, at: i });
    else if (/\p{L}/u.test(graphemeAt(text, i))) {
      return { message: `I could not read the word ${quoteInput(wordAt(text, i))}.`, at: i };
    } else if (ch === '(' || ch === ')') {
      return {
        message:
          'Brackets are not part of the problems Workback checks; write one operation, such as 27 × 4.',
        at: i,
      };
    } else if (ch === ',' || ch === '.') {
      return { message: `I could not read the “${ch}” here; it is not part of a number.`, at: i };
    } else {
      return { message: `I could not read ${quoteInput(graphemeAt(text, i))}.`, at: i };
    }
    i += 1;
  }
  return tokens;
}

function readTerms(
  tokens: readonly Token[],
): { terms: Term[]; ops: { op: Operation; at: number }[] } | ReadError {
  const terms: Term[] = [];
  const ops: { op: Operation; at: number }[] = [];
  for (let k = 0; k < tokens.length; k += 1) {
    const tk = tokens[k] as Token;
    const wantTerm = k % 2 === 0;
    if (wantTerm) {
      if (tk.t === 'num') {
        const read = readWhole(tk.text, tk.at);
        if (!read.ok) return read.error;
        terms.push({ t: 'num', value: read.value, at: tk.at });
      } else if (tk.t === 'blank') terms.push({ t: 'blank', at: tk.at });
      else return { message: `A number should come before ${quoteInput(tk.text)}.`, at: tk.at };
    } else if (tk.t === 'op') ops.push({ op: tk.op, at: tk.at });
    else if (tk.t === 'slash') ops.push({ op: '÷', at: tk.at });
    else
      return {
        message: `An operation sign (+, −, ×, ÷) should come before ${quoteInput(tk.text)}.`,
        at: tk.at,
      };
  }
  if (tokens.length % 2 === 0) {
    const last = tokens[tokens.length - 1] as Token;
    return { message: `A number should follow ${quoteInput(last.text)}.`, at: last.at };
  }
  return { terms, ops };
}

function parseExpression(tokens: readonly Token[], allowBlank: boolean): ParsedProblem {
  const read = readTerms(tokens);
  if ('message' in read) return { ok: false, error: read };
  const { terms, ops } = read;
  const blank = terms.find((term) => term.t === 'blank');
  if (blank !== undefined) {
    return fail(
      allowBlank
        ? 'A missing number “?” needs an “=” to say what the problem equals, as in 90 − ? = 35.'
        : 'Only one number can be missing.',
      blank.at,
    );
  }
  if (ops.length === 0)
    return fail('This is a single number; add the operation, such as 304 − 75.');
  const first = ops[0] as { op: Operation; at: number };
  const other = ops.find((o) => o.op !== first.op);
  if (other !== undefined) {
    return fail(
      `This problem mixes ${first.op} and ${other.op}; Workback checks one kind of operation at a time.`,
      other.at,
    );
  }
  const values = terms.map((term) => (term.t === 'num' ? term.value : ''));
  return buildPlain(first.op, values, ops[1]?.at);
}

function buildPlain(op: Operation, values: readonly string[], secondOpAt?: number): ParsedProblem {
  if (op === '+') {
    return {
      ok: true,
      problem: { kind: 'addition', addends: values, text: formatExpression(values, '+') },
    };
  }
  if (values.length > 2) {
    const name = op === '−' ? 'subtraction' : op === '×' ? 'multiplication' : 'division';
    return fail(`Write one ${name} at a time, with two numbers.`, secondOpAt);
  }
  const [a, b] = values as [string, string];
  if (op === '−') {
    if (compareWhole(a, b) < 0) {
      return fail(
        `${b} is larger than ${a}, so the answer would be below zero; Workback checks subtraction with the larger number first.`,
      );
    }
    return {
      ok: true,
      problem: {
        kind: 'subtraction',
        minuend: a,
        subtrahend: b,
        text: formatExpression(values, '−'),
      },
    };
  }
  if (op === '×') {
    return {
      ok: true,
      problem: { kind: 'multiplication', factors: [a, b], text: formatExpression(values, '×') },
    };
  }
  if (b === '0') return fail('Dividing by 0 has no answer; check the number after ÷.');
  if (a.length > MAX_DIVISION_DIGITS || b.length > MAX_DIVISION_DIGITS) {
    return fail(`Workback works long division with numbers up to ${MAX_DIVISION_DIGITS} digits.`);
  }
  return {
    ok: true,
    problem: { kind: 'division', dividend: a, divisor: b, text: formatExpression(values, '÷') },
  };
}

function parseEquation(
  left: readonly Token[],
  right: readonly Token[],
  eqAt: number,
): ParsedProblem {
  const l = readTerms(left);
  if ('message' in l) return { ok: false, error: l };
  const r = readTerms(right);
  if ('message' in r) return { ok: false, error: r };
  // One side is a single number or blank, the other the operation.
  let single: Term;
  let expr: { terms: Term[]; ops: { op: Operation; at: number }[] };
  if (l.terms.length === 1 && r.terms.length > 1) {
    single = l.terms[0] as Term;
    expr = r;
  } else if (r.terms.length === 1 && l.terms.length > 1) {
    single = r.terms[0] as Term;
    expr = l;
  } else if (l.terms.length === 1 && r.terms.length === 1) {
    return fail('There is no operation on either side of the “=”.', eqAt);
  } else {
    return fail(
      'Workback checks equations with one operation on one side of the “=”, as in 90 − ? = 35.',
      eqAt,
    );
  }
  const blanks = [single, ...expr.terms].filter((term) => term.t === 'blank');
  if (blanks.length === 0) {
    return fail(
      'Nothing is missing here: put a ? where the number to find goes, as in 90 − ? = 35.',
      eqAt,
    );
  }
  if (blanks.length > 1)
    return fail('Only one number can be missing; there is more than one ?.', blanks[1]?.at);
  if (single.t === 'blank') {
    // `58 + 67 = ?` is the plain problem.
    return parseExpression(left.length > 1 ? left : right, false);
  }
  const first = expr.ops[0] as { op: Operation; at: number };
  const other = expr.ops.find((o) => o.op !== first.op);
  if (other !== undefined) {
    return fail(
      `This problem mixes ${first.op} and ${other.op}; Workback checks one kind of operation at a time.`,
      other.at,
    );
  }
  if (expr.terms.length > 2) {
    return fail(
      'With a missing number, write one operation with two numbers, as in ? + 38 = 91.',
      expr.ops[1]?.at,
    );
  }
  const [ta, tb] = expr.terms as [Term, Term];
  const a = ta.t === 'num' ? ta.value : null;
  const b = tb.t === 'num' ? tb.value : null;
  const result = single.value;
  const solved = solveBlank(first.op, a, b, result);
  if (solved !== null) return fail(solved);
  const shown = `${a ?? '?'} ${first.op} ${b ?? '?'} = ${result}`;
  return { ok: true, problem: { kind: 'missing', op: first.op, a, b, result, text: shown } };
}

/** Returns why no single whole number fits the blank, or null when one does. */
function solveBlank(op: Operation, a: string | null, b: string | null, c: string): string | null {
  const known = BigInt((a ?? b) as string);
  const res = BigInt(c);
  const none = 'No whole number fits the ? here, so Workback cannot check an answer for it.';
  const any = 'Every number fits the ? here, so there is no single answer to check.';
  switch (op) {
    case '+':
      return res >= known ? null : none;
    case '−':
      if (a === null) return null; // ? − b = c → c + b
      return known >= res ? null : none; // a − ? = c → a − c
    case '×':
      if (known === 0n) return res === 0n ? any : none;
      return res % known === 0n ? null : none;
    case '÷':
      if (a === null)
        return known === 0n ? 'Dividing by 0 has no answer; check the number after ÷.' : null;
      if (res === 0n) return known === 0n ? any : none; // a ÷ ? = 0 only when a is 0
      return known % res === 0n ? null : none;
  }
}

function parseFractions(tokens: readonly Token[]): ParsedProblem | null {
  const shape = tokens
    .map((tk) =>
      tk.t === 'num'
        ? 'n'
        : tk.t === 'slash'
          ? '/'
          : tk.t === 'op'
            ? 'o'
            : tk.t === 'blank'
              ? '?'
              : '=',
    )
    .join('');
  if (shape === 'n/n' || /=/.test(shape)) return null; // plain division, or an equation
  if (shape !== 'n/non/n' && shape !== 'n/n?n/n') {
    const at = tokens.find((tk) => tk.t === 'slash')?.at;
    return fail(
      'I could not tell how “/” is meant here: write fractions as 1/2 + 1/3 or 3/8 ? 1/2, and division as 612 ÷ 6 (or 612 / 6).',
      at,
    );
  }
  const read = (k: number): Fraction | ReadError => {
    const n = tokens[k] as Token;
    const d = tokens[k + 2] as Token;
    const nr = readWhole(n.text, n.at);
    if (!nr.ok) return nr.error;
    const dr = readWhole(d.text, d.at);
    if (!dr.ok) return dr.error;
    if (
      Number(nr.value) > MAX_FRACTION_PART ||
      Number(dr.value) > MAX_FRACTION_PART ||
      nr.value.length > 6 ||
      dr.value.length > 6
    ) {
      return {
        message: `The fraction ${n.text}/${d.text} has parts too large for Workback (up to ${MAX_FRACTION_PART}).`,
        at: n.at,
      };
    }
    if (dr.value === '0')
      return {
        message: `The fraction ${n.text}/${d.text} has 0 as its bottom number (denominator), which has no meaning.`,
        at: d.at,
      };
    return { numerator: Number(nr.value), denominator: Number(dr.value) };
  };
  const left = read(0);
  if ('message' in left) return { ok: false, error: left };
  const right = read(4);
  if ('message' in right) return { ok: false, error: right };
  const mid = tokens[3] as Token;
  if (mid.t === 'blank') {
    return {
      ok: true,
      problem: {
        kind: 'fraction-comparison',
        left,
        right,
        text: `${formatFraction(left)} ? ${formatFraction(right)}`,
      },
    };
  }
  if (mid.t !== 'op' || (mid.op !== '+' && mid.op !== '−')) {
    return fail(
      `Workback adds, subtracts and compares fractions; ${quoteInput(mid.text)} between fractions is not checked yet.`,
      mid.at,
    );
  }
  if (mid.op === '−' && left.numerator * right.denominator < right.numerator * left.denominator) {
    return fail(
      `${formatFraction(right)} is larger than ${formatFraction(left)}, so the answer would be below zero.`,
    );
  }
  return {
    ok: true,
    problem: {
      kind: 'fraction-sum',
      op: mid.op,
      left,
      right,
      text: `${formatFraction(left)} ${mid.op} ${formatFraction(right)}`,
    },
  };
}

function parseRounding(text: string, offset: number): ParsedProblem {
  const m = /^round\s+(\S+)\s+to\s+(?:the\s+)?nearest\s+(.+?)\s*[.!]?$/i.exec(text);
  if (m === null) {
    return fail(
      'I could not read this rounding question; write it like “round 3456 to the nearest hundred”.',
      offset,
    );
  }
  const numberText = m[1] as string;
  const read = readWhole(numberText, offset + text.indexOf(numberText));
  if (!read.ok) return { ok: false, error: read.error };
  const placeText = (m[2] as string).toLowerCase().replace(/\s+/g, ' ');
  const place = readPlace(placeText);
  if (place === null) {
    return fail(
      `${quoteInput(m[2] as string)} is not a place I can round to: use ten, hundred, thousand, ten thousand, hundred thousand or million.`,
      offset + text.lastIndexOf(m[2] as string),
    );
  }
  return {
    ok: true,
    problem: {
      kind: 'rounding',
      value: read.value,
      place,
      text: `round ${read.value} to the nearest ${place.name}`,
    },
  };
}

function readPlace(text: string): RoundingPlace | null {
  const singular = text.replace(/s$/, '');
  // Own keys only: “__proto__” or “constructor” is not a place.
  if (Object.hasOwn(PLACES, singular))
    return { name: singular, exponent: PLACES[singular] as number };
  const digits = text.replace(/,/g, '');
  if (/^10+$/.test(digits) && digits.length - 1 <= 6 && digits.length - 1 <= MAX_DIGITS) {
    const exponent = digits.length - 1;
    const name = Object.keys(PLACES).find((key) => PLACES[key] === exponent) as string;
    return { name, exponent };
  }
  return null;
}
