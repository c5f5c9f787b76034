import { graphemeAt } from './graphemeAt.js';
import { quoteInput } from './quoteInput.js';
import { readWhole } from './readWhole.js';
import type { ParsedAnswer } from './types.js';

const fail = (message: string, at?: number): ParsedAnswer => ({
  ok: false,
  error: at === undefined ? { message } : { message, at },
});

/**
 * Reads a child's answer: a whole number (commas allowed), `q R r` (any case, spaces
 * optional), a decimal, a fraction or mixed number, or a comparison sign.
 *
 * `parseAnswer('7 r 3')` → `{ ok: true, answer: { kind: 'remainder', quotient: '7', remainder: '3', text: '7 R 3' } }`;
 * `parseAnswer('7 R')` → an error saying the remainder after “R” is missing.
 */
export function parseAnswer(text: string): ParsedAnswer {
  const s = text.trim();
  const offset = text.indexOf(s);
  if (s === '') return fail('Type the answer the child wrote.');
  if (s === '<' || s === '>' || s === '=')
    return { ok: true, answer: { kind: 'comparison', sign: s, text: s } };

  // Money: "$8.75" is read as 8.75.
  if (/^\$\s*[\d.]/.test(s)) {
    const amount = parseAnswer(s.replace(/^\$\s*/, ''));
    if (amount.ok && (amount.answer.kind === 'whole' || amount.answer.kind === 'decimal'))
      return amount;
    return fail('After “$” write an amount, such as $8.75.', offset);
  }
  const clock = /^(\d{1,3}):(\d{2,3})$/.exec(s);
  if (clock !== null) {
    const hours = String(Number(clock[1]));
    const minutes = clock[2] as string;
    return { ok: true, answer: { kind: 'clock', hours, minutes, text: `${hours}:${minutes}` } };
  }

  const rem = /^([\d,]+)\s*[rR]\s*([\d,]*)$/.exec(s);
  if (rem !== null) {
    if ((rem[2] as string) === '')
      return fail('The remainder after “R” is missing.', offset + s.length);
    const q = readWhole(rem[1] as string, offset);
    if (!q.ok) return { ok: false, error: q.error };
    const r = readWhole(rem[2] as string, offset + s.lastIndexOf(rem[2] as string));
    if (!r.ok) return { ok: false, error: r.error };
    return {
      ok: true,
      answer: {
        kind: 'remainder',
        quotient: q.value,
        remainder: r.value,
        text: `${q.value} R ${r.value}`,
      },
    };
  }

  const dec = /^([\d,]*)\.(\d+)$/.exec(s);
  if (dec !== null) {
    const wholeText = (dec[1] as string) === '' ? '0' : (dec[1] as string);
    const w = readWhole(wholeText, offset);
    if (!w.ok) return { ok: false, error: w.error };
    const decimals = dec[2] as string;
    return {
      ok: true,
      answer: { kind: 'decimal', whole: w.value, decimals, text: `${w.value}.${decimals}` },
    };
  }

  const frac = /^(?:(\d+)\s+)?(\d+)\s*\/\s*(\d+)$/.exec(s);
  if (frac !== null) {
    const whole = frac[1] === undefined ? 0 : Number(frac[1]);
    const numerator = Number(frac[2]);
    const denominator = Number(frac[3]);
    if (denominator === 0)
      return fail(
        `The fraction ${frac[2]}/${frac[3]} has 0 as its bottom number (denominator).`,
        offset + s.lastIndexOf('/') + 1,
      );
    if (!Number.isSafeInteger(whole) || numerator > 999_999 || denominator > 999_999) {
      return fail('The numbers in this fraction are too large for Workback.', offset);
    }
    const shown =
      whole === 0 && frac[1] === undefined
        ? `${numerator}/${denominator}`
        : `${whole} ${numerator}/${denominator}`;
    return { ok: true, answer: { kind: 'fraction', whole, numerator, denominator, text: shown } };
  }

  if (/^[\d,]+$/.test(s)) {
    const w = readWhole(s, offset);
    if (!w.ok) return { ok: false, error: w.error };
    return { ok: true, answer: { kind: 'whole', value: w.value, text: w.value } };
  }

  if (/^[-−–]\s*\d/.test(s))
    return fail('Answers below zero are not part of the problems Workback checks.', offset);
  // A word (not the R of a remainder) is named whole: “rem”, “forty-three”.
  const word = /\p{L}+(?:[-'’]\p{L}+)*/gu;
  for (let m = word.exec(s); m !== null; m = word.exec(s)) {
    if (/^r$/i.test(m[0])) continue;
    const hint = /^rem(ainder)?s?$/i.test(m[0])
      ? 'write a remainder with R, as in 7 R 3'
      : 'write the answer in digits, as in 43';
    return fail(
      `I could not read the word ${quoteInput(m[0])} in the answer; ${hint}.`,
      offset + m.index,
    );
  }
  const bad = /[^\d\s,./rR<>=]/u.exec(s);
  if (bad !== null)
    return fail(
      `I could not read ${quoteInput(graphemeAt(s, bad.index))} in the answer.`,
      offset + bad.index,
    );
  return fail(
    `I could not read the answer ${quoteInput(s)}; write a number, q R r, a fraction or <, >, =.`,
    offset,
  );
}
