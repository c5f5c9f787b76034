import { describe, expect, it } from 'vitest';
import { parseAnswer } from './parseAnswer.js';

describe('parseAnswer', () => {
  it.each([
    ['139', { kind: 'whole', value: '139' }],
    ['28,991', { kind: 'whole', value: '28991' }],
    [' 007 ', { kind: 'whole', value: '7' }],
    ['7 R 3', { kind: 'remainder', quotient: '7', remainder: '3', text: '7 R 3' }],
    ['7r3', { kind: 'remainder', quotient: '7', remainder: '3' }],
    ['21 r 2', { kind: 'remainder', quotient: '21', remainder: '2' }],
    ['7.3', { kind: 'decimal', whole: '7', decimals: '3' }],
    ['.5', { kind: 'decimal', whole: '0', decimals: '5' }],
    ['2/5', { kind: 'fraction', whole: 0, numerator: 2, denominator: 5, text: '2/5' }],
    ['1 1/4', { kind: 'fraction', whole: 1, numerator: 1, denominator: 4 }],
    ['<', { kind: 'comparison', sign: '<' }],
    ['=', { kind: 'comparison', sign: '=' }],
  ])('reads %j', (text, expected) => {
    expect(parseAnswer(text)).toMatchObject({ ok: true, answer: expected });
  });

  it.each([
    ['', /Type the answer/],
    ['7 R', /remainder after “R” is missing/],
    ['3/0', /0 as its bottom number/],
    ['-5', /below zero/],
    ['12,34', /comma/],
    ['seven', /the word “seven”/],
    // Issue 11 §3: a word is named whole, an emoji is quoted whole, long input is shortened.
    ['7 rem 3', /the word “rem”.*R, as in 7 R 3/],
    ['forty-three', /the word “forty-three”.*digits/],
    ['4😀3', /“😀”/],
    ['4👨‍👩‍👧3', /“👨‍👩‍👧”/],
    ['9'.repeat(500), /“9{32}…” is longer than 30 digits/],
    ['7 R 3 R 1', /could not read the answer/],
  ])('refuses %j', (text, message) => {
    const read = parseAnswer(text);
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.error.message).toMatch(message);
  });
});
