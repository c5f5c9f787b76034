import { stripLeadingZeros } from '../numbers/digits.js';
import type { ClockTime, DecimalNumber, ParsedProblem } from './types.js';

const SIGNS: Readonly<Record<string, '+' | '−' | '×'>> = {
  '+': '+',
  '-': '−',
  '−': '−',
  '–': '−',
  x: '×',
  X: '×',
  '×': '×',
  '*': '×',
};

/** Longest decimal part Workback lines up (thousandths and a little past them). */
const MAX_DECIMALS = 6;
const NUMBER = String.raw`\$?\s*\d[\d,]*(?:\.\d+)?|\$?\s*\.\d+`;
const TWO_TERMS = new RegExp(String.raw`^(${NUMBER})\s*([-+−–xX×*?])\s*(${NUMBER})$`);
const CLOCK = /^(\d{1,2}):(\d{2})\s*([-+−–])\s*(\d{1,2}):(\d{2})$/;

/** `formatDecimal({ whole: '12', decimals: '50' }, true)` → `'$12.50'`. */
export function formatDecimal(n: DecimalNumber, money = false): string {
  return `${money ? '$' : ''}${n.whole}${n.decimals === '' ? '' : `.${n.decimals}`}`;
}

/** `formatClock({ hours: 3, minutes: 5 })` → `'3:05'`. */
export function formatClock(t: ClockTime): string {
  return `${t.hours}:${String(t.minutes).padStart(2, '0')}`;
}

function readDecimal(raw: string): DecimalNumber | string {
  const text = raw.replace(/^\$\s*/, '');
  const [wholeText = '', decimals = ''] = text.split('.');
  const whole = wholeText === '' ? '0' : wholeText;
  if (!/^\d+$/.test(whole) && !/^\d{1,3}(,\d{3})+$/.test(whole))
    return `“${raw}” has a comma in an unexpected place; commas can only separate thousands.`;
  if (decimals.length > MAX_DECIMALS)
    return `“${raw}” has more than ${MAX_DECIMALS} digits after the point.`;
  const digits = stripLeadingZeros(whole.replace(/,/g, ''));
  if (digits.length > 15) return `“${raw}” is too long for Workback to lay out in columns.`;
  return { whole: digits, decimals };
}

/**
 * Reads the problems with a decimal point, a leading `$` or a clock time: decimals and money in
 * `+ − ×` and comparisons (`4.5 + 2.25`, `$12.50 - $3.75`, `0.45 ? 0.5`), clock times in `+ −`
 * (`3:15 - 1:50`). `null` when the text is none of these (the whole-number parser reads it).
 *
 * `parseMeasured('$12.50 - $3.75')` → `{ ok: true, problem: { kind: 'decimal', op: '−',
 * left: { whole: '12', decimals: '50' }, right: { whole: '3', decimals: '75' }, money: true,
 * text: '$12.50 − $3.75' } }`.
 */
export function parseMeasured(text: string): ParsedProblem | null {
  const s = text.trim();
  const clock = CLOCK.exec(s);
  if (clock !== null) {
    const [, h1, m1, sign, h2, m2] = clock as unknown as [
      string,
      string,
      string,
      string,
      string,
      string,
    ];
    const left = { hours: Number(h1), minutes: Number(m1) };
    const right = { hours: Number(h2), minutes: Number(m2) };
    for (const t of [left, right])
      if (t.minutes > 59)
        return {
          ok: false,
          error: {
            message: `${formatClock(t)} has more than 59 minutes; write it as hours and minutes.`,
          },
        };
    const op = SIGNS[sign] as '+' | '−';
    if (op === '−' && left.hours * 60 + left.minutes < right.hours * 60 + right.minutes)
      return {
        ok: false,
        error: {
          message:
            'The second time is longer than the first; Workback checks differences that are not below zero.',
        },
      };
    return {
      ok: true,
      problem: {
        kind: 'clock',
        op,
        left,
        right,
        text: `${formatClock(left)} ${op} ${formatClock(right)}`,
      },
    };
  }
  if (!/[.$]/.test(s)) return null;
  const m = TWO_TERMS.exec(s);
  if (m === null) return null;
  const [, a = '', sign = '', b = ''] = m;
  const left = readDecimal(a.trim());
  if (typeof left === 'string') return { ok: false, error: { message: left } };
  const right = readDecimal(b.trim());
  if (typeof right === 'string') return { ok: false, error: { message: right } };
  const money = a.includes('$') || b.includes('$');
  if (sign === '?') {
    if (money)
      return { ok: false, error: { message: 'Compare plain decimals, such as 0.45 ? 0.5.' } };
    return {
      ok: true,
      problem: {
        kind: 'decimal-comparison',
        left,
        right,
        text: `${formatDecimal(left)} ? ${formatDecimal(right)}`,
      },
    };
  }
  const op = SIGNS[sign];
  if (op === undefined) return null;
  if (op === '−' && compareDecimals(left, right) < 0)
    return {
      ok: false,
      error: {
        message:
          'The second number is larger than the first; Workback checks differences that are not below zero.',
      },
    };
  if (money && op === '×' && a.includes('$') && b.includes('$'))
    return {
      ok: false,
      error: { message: 'Multiply an amount of money by a number, such as $2.35 × 4.' },
    };
  return {
    ok: true,
    problem: {
      kind: 'decimal',
      op,
      left,
      right,
      money,
      text: `${formatDecimal(left, money && a.includes('$'))} ${op} ${formatDecimal(right, money && b.includes('$'))}`,
    },
  };
}

/** Numeric order of two decimals: `compareDecimals(0.45, 0.5)` → `-1`. */
export function compareDecimals(a: DecimalNumber, b: DecimalNumber): -1 | 0 | 1 {
  if (a.whole.length !== b.whole.length) return a.whole.length < b.whole.length ? -1 : 1;
  if (a.whole !== b.whole) return a.whole < b.whole ? -1 : 1;
  const places = Math.max(a.decimals.length, b.decimals.length);
  const da = a.decimals.padEnd(places, '0');
  const db = b.decimals.padEnd(places, '0');
  return da === db ? 0 : da < db ? -1 : 1;
}
