import { diagnose } from '@workback/core';

export type LocalCheck =
  | { status: 'agrees' }
  | { status: 'disagrees' | 'unreadable-answer'; message: string }
  | { status: 'not-checked' };

/** `1128` → `1,128` (whole numbers of four digits or more). */
const withCommas = (text: string) =>
  text.replace(/(?<![.\d])\d{4,}/g, (digits) => digits.replace(/\B(?=(\d{3})+(?!\d))/g, ','));

function workedOut(problem: { kind: string; text: string }, expected: string): string {
  const text = withCommas(problem.text);
  const value = withCommas(expected);
  if (problem.kind === 'rounding') return `${text} is ${value}`;
  if (problem.kind === 'missing') return `the missing number in ${text} is ${value}`;
  if (problem.kind === 'fraction-comparison' || problem.kind === 'decimal-comparison')
    return text.replace('?', value);
  return `${text} = ${value}`;
}

/**
 * The engine's cross-check of one key item, worked in the browser as the parent types, in the
 * same words as the API's: `checkItem('47 x 24', '1,138')` → “the key says 1,138, but 47 × 24 =
 * 1,128 — please check”. Prompts the engine cannot read (word problems) are `not-checked`; the
 * typed answer is never changed.
 */
export function checkItem(prompt: string, answer: string): LocalCheck {
  if (!prompt.trim() || !answer.trim()) return { status: 'not-checked' };
  try {
    const result = diagnose(prompt, answer);
    if (result.ok) {
      return result.correct
        ? { status: 'agrees' }
        : {
            status: 'disagrees',
            message: `The key says ${answer.trim()}, but ${workedOut(result.problem, result.expected)} — please check.`,
          };
    }
    if (result.part !== 'answer') return { status: 'not-checked' };
    const worked = diagnose(prompt, '0');
    if (!worked.ok) return { status: 'not-checked' };
    return {
      status: 'unreadable-answer',
      message: `The checker cannot read “${answer.trim()}”; ${workedOut(worked.problem, worked.expected)} — please check.`,
    };
  } catch {
    return { status: 'not-checked' };
  }
}
