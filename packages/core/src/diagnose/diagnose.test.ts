import { describe, expect, it } from 'vitest';
import { diagnose } from './diagnose.js';
import { ENGINE_VERSION } from './engineVersion.js';
import type { Diagnosis } from './types.js';

const ok = (p: string, a: string, steps?: { partials?: string[]; lines?: string[] }): Diagnosis => {
  const d = diagnose(p, a, steps === undefined ? {} : { steps });
  if (!d.ok) throw new Error(`unreadable: ${d.error.message}`);
  return d;
};

describe('diagnose', () => {
  it('gives the Diagnosis shape of DESIGN.md for 81 − 38 → 57', () => {
    // Example from DESIGN.md, "Core engine contract".
    const d = ok('81 - 38', '57');
    expect(d).toMatchObject({
      expected: '43',
      answer: '57',
      correct: false,
      firstWrongStep: { place: 'ones', expected: '3', written: '7' },
      engineVersion: ENGINE_VERSION,
    });
    expect(d.rules[0]).toMatchObject({ id: 'sub.smaller-from-larger', score: 1 });
    expect(d.checks.nines.applies).toBe(true);
    expect(d.checks.elevens.applies).toBe(true);
    expect(d.trace.expected.kind).toBe('column-subtraction');
    expect(d.trace.child?.ruleId).toBe('sub.smaller-from-larger');
    expect(d.suggestedCause?.cause).toBe('step');
    expect(JSON.parse(JSON.stringify(d))).toEqual(d);
  });

  it('shows borrowing across zeros step by step in the correct working', () => {
    const d = ok('304 - 75', '139');
    if (d.trace.expected.kind !== 'column-subtraction') throw new Error('kind');
    const marks = d.trace.expected.columns.map((c) => c.marks);
    expect(marks).toEqual([
      [4, 14],
      [0, 10, 9],
      [3, 2],
    ]);
    expect(d.trace.expected.regroupings).toEqual([
      { from: 2, to: 1, kind: 'regroup' },
      { from: 1, to: 0, kind: 'regroup' },
    ]);
    if (d.trace.child?.working.kind !== 'column-subtraction') throw new Error('child');
    expect(d.trace.child.working.regroupings[0]).toEqual({ from: 2, to: 0, kind: 'skip-zeros' });
  });

  it('ranks a systematic rule above a fact rule', () => {
    // 81 − 38 → 53 is sub.borrow-no-decrement (DESIGN.md) and also a tens-column fact slip (7 − 3 as 4 + 1).
    const d = ok('81 - 38', '53');
    expect(d.rules.map((r) => r.id)).toEqual(['sub.borrow-no-decrement', 'sub.fact']);
    expect(d.rules[0]?.score).toBeGreaterThan(d.rules[1]?.score ?? 1);
    expect(d.facts).toEqual([]);
  });

  it('keeps catalog order for ties', () => {
    // 143 − 28 → 125: Brown & Burton's borrow-no-decrement example, which smaller-from-larger also gives.
    const d = ok('143 - 28', '125');
    expect(d.rules.slice(0, 2).map((r) => r.id)).toEqual([
      'sub.smaller-from-larger',
      'sub.borrow-no-decrement',
    ]);
  });

  it('lists a fact error in facts, e.g. 7 × 8 written 54', () => {
    const d = ok('7 x 8', '54'); // DESIGN.md's facts example
    expect(d.rules.map((r) => r.id)).toEqual(['mul.fact']);
    expect(d.facts).toEqual([
      { op: 'x', a: 7, b: 8, expected: 56, written: 54, where: 'the basic fact' },
    ]);
    expect(d.suggestedCause?.cause).toBe('fact');
  });

  it('finds a fact slip inside a longer multiplication', () => {
    // 47 × 8 = 376; with 7 × 8 taken as 54 the working gives 4 carried, 4 × 8 + 5 = 37 → 374 (computed).
    const d = ok('47 x 8', '374');
    expect(d.rules[0]?.id).toBe('mul.fact');
    expect(d.facts[0]).toMatchObject({ a: 7, b: 8, expected: 56, written: 54 });
  });

  it('finds a subtraction fact slip and where it is', () => {
    const d = ok('81 - 38', '42');
    expect(d.rules.map((r) => r.id)).toEqual(['sub.fact']);
    expect(d.facts).toEqual([
      { op: '-', a: 11, b: 8, expected: 3, written: 2, where: 'ones column' },
    ]);
    expect(d.firstWrongStep).toMatchObject({ place: 'ones', expected: '3', written: '2' });
  });

  it('reports two rules together after the single rules', () => {
    // borrow-across-zero leaves the tens 0, then 0 − 7 is written as 7.
    const d = ok('304 - 75', '279');
    expect(d.rules[0]).toMatchObject({
      id: 'sub.borrow-across-zero+sub.zero-minus-n-is-n',
      ids: ['sub.borrow-across-zero', 'sub.zero-minus-n-is-n'],
    });
    expect(d.rules[0]?.score).toBeLessThan(1);
  });

  it('reports a rule plus one fact slip in another column', () => {
    // 352 − 127 by sub.borrow-no-decrement (and by smaller-from-larger) gives 235 (computed);
    // with 3 − 1 taken as 1 in the hundreds, 135.
    const d = ok('352 - 127', '135');
    expect(d.rules.map((r) => r.id)).toEqual([
      'sub.smaller-from-larger+sub.fact',
      'sub.borrow-no-decrement+sub.fact',
    ]);
    expect(d.facts[0]).toMatchObject({
      op: '-',
      a: 3,
      b: 1,
      expected: 2,
      written: 1,
      where: 'hundreds column',
    });
    expect(d.suggestedCause?.cause).toBe('step');
  });

  it('says so honestly when nothing reproduces the answer', () => {
    // 63 × 8 → 124 (carry multiplied instead of added) is not in the catalog (reference README).
    const d = ok('63 x 8', '124');
    expect(d.rules).toEqual([]);
    expect(d.facts).toEqual([]);
    expect(d.firstWrongStep).not.toBeNull();
    expect(d.trace.child).toBeNull();
  });

  it('uses written partial products: mul.partials-added-wrong needs them', () => {
    const without = ok('34 x 12', '418');
    expect(without.rules.map((r) => r.id)).not.toContain('mul.partials-added-wrong');
    const withSteps = ok('34 x 12', '418', { partials: ['68', '340'] });
    expect(withSteps.rules[0]?.id).toBe('mul.partials-added-wrong');
    expect(withSteps.firstWrongStep).toMatchObject({ place: 'tens' });
    const wrongPartial = ok('34 x 12', '102', { partials: ['68', '34'] });
    expect(wrongPartial.firstWrongStep).toMatchObject({
      place: 'partial product 2',
      expected: '340',
      written: '34',
    });
    expect(wrongPartial.rules[0]?.id).toBe('mul.no-placeholder');
    // A rule must reproduce the written steps as well as the answer.
    const mismatch = ok('34 x 12', '102', { partials: ['68', '43'] });
    expect(mismatch.rules.map((r) => r.id)).not.toContain('mul.no-placeholder');
  });

  it('uses written long-division lines for the first wrong step', () => {
    const d = ok('45 ÷ 6', '6 R 9', { lines: ['36', '9'] });
    expect(d.rules[0]?.id).toBe('div.remainder-too-large');
    expect(d.firstWrongStep).toMatchObject({
      place: 'step 1 product',
      expected: '42',
      written: '36',
    });
  });

  it('accepts a right value in another form, with a note', () => {
    expect(ok('1/4 + 1/2', '6/8')).toMatchObject({
      correct: true,
      notes: [expect.stringContaining('3/4')],
    });
    expect(ok('2/4 + 3/4', '1 1/4').correct).toBe(true);
    expect(ok('45 ÷ 6', '7.5').correct).toBe(true);
    expect(ok('612 ÷ 6', '102 R 0').correct).toBe(true);
  });

  it('reads an answer of the wrong kind as a different answer, not an error', () => {
    const d = ok('304 - 75', '<');
    expect(d.correct).toBe(false);
    expect(d.notes[0]).toContain('not a whole number');
  });

  it('refuses what it cannot read, naming the part', () => {
    expect(diagnose('304 $ 75', '1')).toMatchObject({
      ok: false,
      part: 'problem',
      error: { at: 4 },
    });
    expect(diagnose('304 - 75', 'abc')).toMatchObject({ ok: false, part: 'answer' });
    expect(diagnose('34 x 12', '408', { steps: { partials: ['6x8'] } })).toMatchObject({
      ok: false,
      part: 'steps',
    });
  });

  it('flags a remainder not smaller than the divisor even where the checks pass', () => {
    // Reference README, blind spots: 59 ÷ 7 → 7 R 10 passes both checks.
    const d = ok('59 ÷ 7', '7 R 10');
    expect(d.rules[0]?.id).toBe('div.remainder-too-large');
    expect(d.checks.nines.passes).toBe(true);
    expect(d.checks.elevens.passes).toBe(true);
    if (!d.checks.nines.applies) throw new Error('applies');
    expect(d.checks.nines.warnings[0]).toContain('not smaller than the divisor 7');
  });
});
