import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dateOfDay, dayNumber } from './dayNumber.js';

const DAY_MS = 86_400_000;

describe('dayNumber and dateOfDay', () => {
  it('agree with JavaScript’s Date (ECMA-262, proleptic Gregorian, UTC) from 1900 to 2200', () => {
    fc.assert(
      fc.property(fc.integer({ min: -25_567, max: 84_000 }), (day) => {
        const iso = new Date(day * DAY_MS).toISOString().slice(0, 10);
        expect(dateOfDay(day)).toBe(iso);
        expect(dayNumber(iso)).toBe(day);
      }),
      { numRuns: 5000 },
    );
  });

  it('counts from 1970-01-01 and across leap days', () => {
    expect(dayNumber('1970-01-01')).toBe(0);
    expect(dayNumber('1970-01-02')).toBe(1);
    expect(dateOfDay(-1)).toBe('1969-12-31');
    // 2000 is a leap year (divisible by 400), 1900 is not: Gregorian rule, from memory.
    expect(dayNumber('2000-03-01') - dayNumber('2000-02-28')).toBe(2);
    expect(dayNumber('1900-03-01') - dayNumber('1900-02-28')).toBe(1);
  });

  it.each(['2026-02-29', '1900-02-29', '2026-13-01', '2026-04-31', '2026-00-10', '2026-3-1'])(
    'refuses %s',
    (text) => {
      expect(() => dayNumber(text)).toThrow();
    },
  );

  it('takes 2024-02-29, a real leap day', () => {
    expect(dateOfDay(dayNumber('2024-02-29'))).toBe('2024-02-29');
  });
});
