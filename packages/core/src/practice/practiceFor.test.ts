import { Decimal } from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { diagnose } from '../diagnose/diagnose.js';
import { RULES } from '../rules/catalog.js';
import { practiceFor } from './practiceFor.js';

describe('practiceFor', () => {
  it.each(
    RULES.filter((r) => r.kind === 'systematic' && r.id !== 'mul.partials-added-wrong').map(
      (r) => r.id,
    ),
  )(
    '%s: makes fresh problems on which the rule gives a different answer',
    (id) => {
      const set = practiceFor(id, { count: 4, digits: 3, seed: 11 });
      if (!set.ok) throw new Error(set.error.message);
      expect(set.problems.length).toBeGreaterThan(0);
      expect(new Set(set.problems.map((p) => p.problem)).size).toBe(set.problems.length);
      for (const p of set.problems) {
        expect(p.ruleAnswer).not.toBe(p.answer);
        const right = diagnose(p.problem, p.answer);
        expect(right.ok && right.correct).toBe(true);
        const wrong = diagnose(p.problem, p.ruleAnswer as string);
        if (!wrong.ok) throw new Error(p.problem);
        expect(wrong.rules.map((r) => r.id)).toContain(id);
      }
    },
    20_000,
  );

  it('is repeatable for a seed and changes with it', () => {
    const a = practiceFor('sub.borrow-across-zero', { count: 5, digits: 4, seed: 3 });
    const b = practiceFor('sub.borrow-across-zero', { count: 5, digits: 4, seed: 3 });
    const c = practiceFor('sub.borrow-across-zero', { count: 5, digits: 4, seed: 4 });
    expect(a).toEqual(b);
    expect(a).not.toEqual(c);
  });

  it('gives fact-rule practice without a fixed wrong answer', () => {
    const set = practiceFor('mul.fact', { count: 3, digits: 2, seed: 1 });
    expect(set.ok && set.problems.every((p) => p.ruleAnswer === null)).toBe(true);
  });

  it('refuses an unknown rule', () => {
    expect(practiceFor('sub.nonsense')).toEqual({
      ok: false,
      error: { message: '“sub.nonsense” is not a rule in the catalog.' },
    });
  });
});

describe('practiceFor in the form of the child’s miss (issue 16)', () => {
  it.each([
    'sub.borrow-no-decrement',
    'sub.borrow-across-zero',
    'add.no-carry',
    'add.carry-written',
  ])(
    '%s: money practice is written with $ and two places, its answers checked by decimal.js',
    (id) => {
      const set = practiceFor(id, { count: 4, digits: 4, seed: 5, form: 'money' });
      if (!set.ok) throw new Error(set.error.message);
      expect(set.problems).toHaveLength(4);
      for (const p of set.problems) {
        const m = /^\$(\d+\.\d{2}) ([+−]) \$(\d+\.\d{2})$/.exec(p.problem);
        if (!m) throw new Error(`not money: ${p.problem}`);
        const [, a, op, b] = m as unknown as [string, string, string, string];
        // The answer against decimal.js (a reference library the project did not write).
        const right = op === '+' ? new Decimal(a).plus(b) : new Decimal(a).minus(b);
        expect(new Decimal(p.answer).equals(right)).toBe(true);
        // Four figures across the point: the child's $12.50 level.
        expect(Math.max(a.length, b.length) - 1).toBeLessThanOrEqual(4);
        const wrong = diagnose(p.problem, p.ruleAnswer as string);
        if (!wrong.ok) throw new Error(p.problem);
        expect(wrong.rules.map((r) => r.id)).toContain(id);
      }
    },
  );

  it('writes decimal practice with a point and money practice for a dropped point with $', () => {
    const decimal = practiceFor('add.no-carry', { count: 3, digits: 3, seed: 2, form: 'decimal' });
    if (!decimal.ok) throw new Error(decimal.error.message);
    for (const p of decimal.problems) expect(p.problem).toMatch(/^\d+\.\d+ \+ \d+\.\d+$/);
    const money = practiceFor('dec.point-dropped', { count: 3, digits: 2, seed: 2, form: 'money' });
    if (!money.ok) throw new Error(money.error.message);
    for (const p of money.problems) expect(p.problem).toMatch(/^\$\d+\.\d{2} [+−] \$\d+\.\d{2}$/);
  });
});
