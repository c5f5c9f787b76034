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
