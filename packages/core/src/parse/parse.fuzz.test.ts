import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { diagnose } from '../diagnose/diagnose.js';
import { parseAnswer } from './parseAnswer.js';
import { parseProblem } from './parseProblem.js';

// Pieces of the problem syntax, so random text often comes close to something readable.
const TOKENS = [
  '1',
  '9',
  '0',
  '304',
  '7,5',
  ',',
  ' ',
  '+',
  '-',
  '−',
  'x',
  '×',
  '*',
  '÷',
  '/',
  '?',
  '_',
  '=',
  'R',
  'r',
  '.',
  '<',
  '>',
  'round',
  'to',
  'the',
  'nearest',
  'ten',
  'hundred',
  'thousand',
  '3/8',
  '½',
  '\u0000',
  '😀',
];
const nearSyntax = fc.array(fc.constantFrom(...TOKENS), { maxLength: 12 }).map((t) => t.join(''));
const anyText = fc.oneof(
  fc.string({ maxLength: 60 }),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  nearSyntax,
);

/** Either a reading or a typed error with a message for a parent: never a throw, never a guess. */
function expectReadOrRefused(result: { ok: boolean; error?: { message: string } }) {
  if (!result.ok) {
    expect(typeof result.error?.message).toBe('string');
    expect(result.error!.message.length).toBeGreaterThan(0);
  }
}

describe('the parser under random input', () => {
  it('parses or refuses with a message for any problem text', () => {
    fc.assert(
      fc.property(anyText, (text) => expectReadOrRefused(parseProblem(text))),
      { numRuns: 5000 },
    );
  });

  it('parses or refuses with a message for any answer text', () => {
    fc.assert(
      fc.property(anyText, (text) => expectReadOrRefused(parseAnswer(text))),
      { numRuns: 5000 },
    );
  });

  it('diagnoses or names the unreadable part for any pair of texts', () => {
    fc.assert(
      fc.property(anyText, anyText, (problem, answer) => {
        const result = diagnose(problem, answer);
        if (!result.ok) {
          expect(['problem', 'answer', 'steps']).toContain(result.part);
          expect(result.error.message.length).toBeGreaterThan(0);
        } else {
          expect(typeof result.correct).toBe('boolean');
        }
      }),
      { numRuns: 3000 },
    );
  });
});
