import { diagnose } from '@workback/core';

export type ItemCheck =
  | { status: 'agrees'; expected: string }
  | { status: 'disagrees'; expected: string; message: string }
  | { status: 'unreadable-answer'; expected: string; message: string }
  | { status: 'not-checked' };

/**
 * Works the item's prompt with the engine and compares the key's answer, for the parent
 * to look at; the typed answer is never changed. Prompts the engine cannot read (word
 * problems, kinds it does not handle yet) are `not-checked`.
 */
export function checkItem(item: { number: number; prompt: string; answer: string }): ItemCheck {
  let expected: string;
  let workedOut: string;
  try {
    const right = diagnose(item.prompt, item.answer);
    if (right.ok) {
      if (right.correct) return { status: 'agrees', expected: right.expected };
      expected = right.expected;
      workedOut = sentenceFor(right.problem, right.expected);
      return {
        status: 'disagrees',
        expected,
        message: `item ${item.number}: the key says ${item.answer}, but ${workedOut} — please check`,
      };
    }
    if (right.part !== 'answer') return { status: 'not-checked' };
    // The key's answer could not be read: work the problem out with a readable stand-in.
    const worked = diagnose(item.prompt, '0');
    if (!worked.ok) return { status: 'not-checked' };
    expected = worked.expected;
    workedOut = sentenceFor(worked.problem, worked.expected);
  } catch {
    return { status: 'not-checked' };
  }
  return {
    status: 'unreadable-answer',
    expected,
    message: `item ${item.number}: the key says “${item.answer}”, which the checker cannot read; ${workedOut} — please check`,
  };
}

function sentenceFor(problem: { kind: string; text: string }, expected: string): string {
  const text = withCommas(problem.text);
  const value = withCommas(expected);
  switch (problem.kind) {
    case 'rounding':
      return `${text} is ${value}`;
    case 'missing':
      return `the missing number in ${text} is ${value}`;
    case 'fraction-comparison':
    case 'decimal-comparison':
      return text.replace('?', value);
    default:
      return `${text} = ${value}`;
  }
}

/** `1128` → `1,128` for whole numbers of four digits or more. */
function withCommas(text: string): string {
  return text.replace(/(?<![.\d])\d{4,}/g, (digits) =>
    digits.replace(/\B(?=(\d{3})+(?!\d))/g, ','),
  );
}
