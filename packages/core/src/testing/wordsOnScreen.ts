// What a diagnosis says in words on one screen (the miss page, the CLI), and the ways those
// words can mislead a parent: a digit below zero, a sentence said twice, or one basic fact
// stated both as right and as slipped. Used by the property tests over the evaluation table.
import type { Diagnosis } from '../diagnose/types.js';

/** Every line of words a diagnosis shows together: where it differs, each explanation, notes, written steps, the suggested cause. */
export function linesOnScreen(d: Diagnosis): string[] {
  return [...otherLines(d), ...d.rules.map((r) => r.explanation)];
}

function otherLines(d: Diagnosis): string[] {
  return [
    ...(d.firstWrongStep === null ? [] : [d.firstWrongStep.note]),
    ...d.notes,
    ...(d.writtenSteps?.steps.flatMap((s) => (s.finding === null ? [] : [s.finding.explanation])) ??
      []),
    ...(d.suggestedCause === null ? [] : [d.suggestedCause.because]),
  ];
}

const OPENER = 'Two things happened together.';
const NEGATIVE = /(^|[\s(])[-−]\d|\b(became|becoming|becomes) [-−]/;
const EXPRESSION = String.raw`\d+(?: [+−×] \d+)+(?: carried)?`;
const STATED = new RegExp(`(${EXPRESSION}) (=|was taken as) (\\d+)`, 'g');

/** A fact's key whatever the order of its parts (`6 + 5` and `5 + 6` alike; subtraction keeps its order). */
function factKey(expression: string): string {
  if (expression.includes('−')) return expression;
  const parts = expression.replace(' carried', '').split(/ [+×] /);
  return `${expression.includes('×') ? '×' : '+'}${expression.includes('carried') ? 'c' : ''}:${parts.sort().join(',')}`;
}

/** `valueOf('5 + 6 + 1 carried')` → `12`; `'13 − 5'` → `8`; `'9 × 4'` → `36`. */
function valueOf(expression: string): number {
  const tokens = expression.replace(' carried', '').split(' ');
  let value = Number(tokens[0]);
  for (let i = 1; i + 1 < tokens.length; i += 2) {
    const n = Number(tokens[i + 1]);
    value = tokens[i] === '+' ? value + n : tokens[i] === '−' ? value - n : value * n;
  }
  return value;
}

/**
 * What misleads in one screen of words, as plain messages (empty when nothing does): a number
 * below zero; a line said twice, or a sentence of one line said again in a line of another
 * kind (a note, a written step, the suggested cause; two explanations are two stories, and may
 * each need the same slip); one explanation stating a fact both as right and as slipped, or a
 * wrong fact as right.
 * `misleadingWords(diagnosis)` → `['“9 × 4” is stated as 36 and as taken as 35']` for an
 * explanation `'At the ones digit 9 × 4 = 36: … 9 × 4 was taken as 35 instead of 36.'`.
 */
export function misleadingWords(d: Diagnosis): string[] {
  const out: string[] = [];
  const lines = linesOnScreen(d);
  lines.forEach((line, i) => {
    if (NEGATIVE.test(line)) out.push(`a number below zero: “${line}”`);
    if (lines.indexOf(line) < i) out.push(`a line said twice: “${line}”`);
    out.push(...contradictions(line));
  });
  const sentencesOf = (line: string): string[] =>
    line.split(/(?<=\.)\s+/).filter((s) => s.length >= 24 && s !== OPENER);
  const others = otherLines(d);
  const seen = new Map<string, number>();
  others.forEach((line, i) => {
    for (const s of sentencesOf(line)) {
      if ((seen.get(s) ?? i) !== i) out.push(`said twice: “${s}”`);
      seen.set(s, i);
    }
  });
  for (const r of d.rules)
    for (const s of sentencesOf(r.explanation)) if (seen.has(s)) out.push(`said twice: “${s}”`);
  return out;
}

/** One explanation stating a wrong fact as right, or one fact both as right and as slipped. */
function contradictions(line: string): string[] {
  const out: string[] = [];
  const right = new Map<string, number>();
  const taken = new Map<string, { expression: string; written: number }>();
  for (const m of line.matchAll(STATED)) {
    const expression = m[1] as string;
    const value = Number(m[3]);
    if (m[2] === 'was taken as') taken.set(factKey(expression), { expression, written: value });
    else if (valueOf(expression) !== value) out.push(`a wrong fact stated as right: “${m[0]}”`);
    else right.set(factKey(expression), value);
  }
  for (const [key, { expression, written }] of taken) {
    const stated = right.get(key);
    if (stated !== undefined && stated !== written)
      out.push(`“${expression}” is stated as ${stated} and as taken as ${written}`);
  }
  return out;
}
