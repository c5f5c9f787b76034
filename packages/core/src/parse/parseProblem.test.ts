import { describe, expect, it } from 'vitest';
import { parseProblem } from './parseProblem.js';

describe('parseProblem accepts', () => {
  it.each([
    ['304 - 75', { kind: 'subtraction', minuend: '304', subtrahend: '75', text: '304 − 75' }],
    ['304 − 75', { kind: 'subtraction', minuend: '304', subtrahend: '75' }],
    ['27,493 + 1,509', { kind: 'addition', addends: ['27493', '1509'] }],
    ['12 + 7 + 30', { kind: 'addition', addends: ['12', '7', '30'] }],
    ['58 + 67 = ?', { kind: 'addition', addends: ['58', '67'] }],
    ['? = 58 + 67', { kind: 'addition', addends: ['58', '67'] }],
    ['27 x 4', { kind: 'multiplication', factors: ['27', '4'], text: '27 × 4' }],
    ['27X4', { kind: 'multiplication', factors: ['27', '4'] }],
    ['27 × 4', { kind: 'multiplication', factors: ['27', '4'] }],
    ['27 * 4', { kind: 'multiplication', factors: ['27', '4'] }],
    ['612 ÷ 6', { kind: 'division', dividend: '612', divisor: '6', text: '612 ÷ 6' }],
    ['612 / 6', { kind: 'division', dividend: '612', divisor: '6' }],
    [
      '90 - ? = 35',
      { kind: 'missing', op: '−', a: '90', b: null, result: '35', text: '90 − ? = 35' },
    ],
    ['? + 38 = 91', { kind: 'missing', op: '+', a: null, b: '38', result: '91' }],
    ['35 = 90 - _', { kind: 'missing', op: '−', a: '90', b: null, result: '35' }],
    ['? / 4 = 8', { kind: 'missing', op: '÷', a: null, b: '4', result: '8' }],
    [
      'round 3456 to nearest hundred',
      { kind: 'rounding', value: '3456', place: { name: 'hundred', exponent: 2 } },
    ],
    [
      'Round 3,456 to the nearest thousand.',
      { kind: 'rounding', value: '3456', place: { name: 'thousand', exponent: 3 } },
    ],
    [
      'round 87 to the nearest 10',
      { kind: 'rounding', value: '87', place: { name: 'ten', exponent: 1 } },
    ],
    [
      '1/2 + 1/3',
      {
        kind: 'fraction-sum',
        op: '+',
        left: { numerator: 1, denominator: 2 },
        right: { numerator: 1, denominator: 3 },
      },
    ],
    ['3/4 - 1/2', { kind: 'fraction-sum', op: '−' }],
    [
      '3/8 ? 1/2',
      {
        kind: 'fraction-comparison',
        left: { numerator: 3, denominator: 8 },
        right: { numerator: 1, denominator: 2 },
      },
    ],
  ])('%s', (text, expected) => {
    const parsed = parseProblem(text);
    expect(parsed).toMatchObject({ ok: true, problem: expected });
  });
});

describe('parseProblem refuses, naming what it did not understand', () => {
  it.each([
    ['', /Type a problem/],
    ['304 $ 75', /“\$”/],
    ['12,34 + 5', /“12,34”.*comma/],
    ['3.5 + 2 + 1', /“3.5” is a decimal.*two numbers/],
    ['3.5 ÷ 2', /“3.5” is a decimal.*two numbers/],
    ['7 + 3 - 2', /mixes \+ and −/],
    ['75 - 304', /304 is larger than 75/],
    ['8 ÷ 0', /Dividing by 0/],
    ['3 + ', /A number should follow “\+”/],
    ['3 + 4 = 7', /Nothing is missing/],
    ['? + ? = 7', /Only one number can be missing/],
    ['? + 9 = 4', /No whole number fits/],
    ['0 x ? = 0', /Every number fits/],
    ['round 3456 to nearest fifty', /“fifty” is not a place/],
    ['round 3456', /rounding question/],
    ['1/0 + 1/2', /0 as its bottom number/],
    ['1/2 + 3', /how “\/” is meant/],
    ['1/3 - 1/2', /below zero/],
    ['(3 + 4)', /Brackets/],
    ['seven + 3', /the word “seven”/],
    ['5', /single number/],
    ['3 ? 4', /An operation sign .* should come before “\?”/],
    ['1'.repeat(31) + ' + 1', /longer than 30 digits/],
  ])('%j', (text, message) => {
    const parsed = parseProblem(text);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.error.message).toMatch(message);
  });

  it('gives the position of the part it did not understand', () => {
    expect(parseProblem('304 $ 75')).toMatchObject({ ok: false, error: { at: 4 } });
    expect(parseProblem('round 3456 to nearest fifty')).toMatchObject({
      ok: false,
      error: { at: 22 },
    });
  });
});
