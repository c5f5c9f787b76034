import { describe, expect, it } from 'vitest';
import { missKindOf } from './missKindOf.js';

describe('missKindOf', () => {
  it.each([
    ['304 - 75', 'whole'],
    ['27 x 4', 'whole'],
    ['round 3456 to nearest hundred', 'whole'],
    ['90 - ? = 35', 'whole'],
    ['1/2 + 1/3', 'fraction'],
    ['3/8 ? 1/2', 'fraction'],
    ['4.5 + 2.25', 'decimal'],
    ['0.45 ? 0.5', 'decimal'],
    ['$12.50 - $3.75', 'money'],
    ['$2.35 x 4', 'money'],
    ['3:15 - 1:50', 'time'],
    ['How many pencils are left?', 'other'],
  ])('reads %s as %s', (problem, kind) => {
    expect(missKindOf(problem)).toBe(kind);
  });

  it('calls a miss with number sentences or an interview stage a word problem, whatever its text', () => {
    expect(missKindOf('Pencils: how many now?', { lines: ['4 x 15 = 60'] })).toBe('word');
    expect(missKindOf('$12.50 - $3.75', { lines: ['12.50 - 3.75 = 19.85'] })).toBe('word');
    expect(missKindOf('Pencils: how many now?', { stage: 'reading' })).toBe('word');
    expect(missKindOf('304 - 75', { lines: [], stage: null })).toBe('whole');
  });
});
