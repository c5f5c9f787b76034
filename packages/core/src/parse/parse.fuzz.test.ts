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
  '👨‍👩‍👧',
  '👍🏽',
  'é',
  '__proto__',
  'constructor',
  'rem',
  'forty-three',
  '9'.repeat(40),
];
const nearSyntax = fc.array(fc.constantFrom(...TOKENS), { maxLength: 12 }).map((t) => t.join(''));
const anyText = fc.oneof(
  fc.string({ maxLength: 60 }),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  nearSyntax,
);

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** A message for a parent: not empty, not endless (input is shortened), no half an emoji. */
function expectReadable(message: string) {
  expect(message.length).toBeGreaterThan(0);
  expect(message.length).toBeLessThan(400);
  expect(message).not.toMatch(LONE_SURROGATE);
}

/** Either a reading or a typed error with a message for a parent: never a throw, never a guess. */
function expectReadOrRefused(result: { ok: boolean; error?: { message: string } }) {
  if (!result.ok) {
    expect(typeof result.error?.message).toBe('string');
    expectReadable(result.error!.message);
  }
}

// Generous timeouts: thousands of runs on a shared 2-core machine (never a speed check).
describe('the parser under random input', () => {
  it('parses or refuses with a message for any problem text', () => {
    fc.assert(
      fc.property(anyText, (text) => expectReadOrRefused(parseProblem(text))),
      { numRuns: 5000 },
    );
  }, 60_000);

  it('parses or refuses with a message for any answer text', () => {
    fc.assert(
      fc.property(anyText, (text) => expectReadOrRefused(parseAnswer(text))),
      { numRuns: 5000 },
    );
  }, 60_000);

  it('diagnoses or names the unreadable part for any pair of texts', () => {
    fc.assert(
      fc.property(anyText, anyText, (problem, answer) => {
        const result = diagnose(problem, answer);
        if (!result.ok) {
          expect(['problem', 'answer', 'steps']).toContain(result.part);
          expectReadable(result.error.message);
        } else {
          expect(typeof result.correct).toBe('boolean');
        }
      }),
      { numRuns: 3000 },
    );
  }, 60_000);

  it('diagnoses or refuses any written steps, never throws (partials and lines of any length)', () => {
    const problem = fc.oneof(
      fc.constantFrom('347 x 26', '27 x 4', '4 x 27', '400 x 30', '84 ÷ 4', '612 ÷ 6', '81 - 38'),
      nearSyntax,
    );
    const step = fc.oneof(fc.nat(99999).map(String), anyText);
    const steps = fc.record(
      { partials: fc.array(step, { maxLength: 6 }), lines: fc.array(step, { maxLength: 10 }) },
      { requiredKeys: [] },
    );
    fc.assert(
      fc.property(problem, fc.nat(99999).map(String), steps, (p, a, s) => {
        const result = diagnose(p, a, { steps: s });
        if (!result.ok) expectReadable(result.error.message);
        else expect(typeof result.correct).toBe('boolean');
      }),
      { numRuns: 3000 },
    );
  }, 60_000);
});
