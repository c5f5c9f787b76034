// The child's written working decides (DESIGN.md, "Written steps decide"; issue 11 §1):
// a hypothesis that contradicts a step written right is not offered, and a step written
// wrong is worked on its own. Products checked by plain BigInt arithmetic beside each case.
import { describe, expect, it } from 'vitest';
import { main } from '../cli/main.js';
import { diagnose } from './diagnose.js';
import type { Diagnosis } from './types.js';

const ok = (p: string, a: string, steps?: { partials?: string[]; lines?: string[] }): Diagnosis => {
  const d = diagnose(p, a, steps === undefined ? {} : { steps });
  if (!d.ok) throw new Error(d.error.message);
  return d;
};

describe('written partial products', () => {
  // 347 × 6 = 2082 and 347 × 20 = 6940 (BigInt below); the child wrote 6840 and added to 8922.
  it('drops a fact slip in a partial product the child wrote right', () => {
    expect(347n * 6n).toBe(2082n);
    expect(347n * 20n).toBe(6940n);
    const without = ok('347 x 26', '8922');
    expect(without.rules.map((r) => r.id)).toContain('mul.fact');
    const d = ok('347 x 26', '8922', { partials: ['2,082', '6840'] });
    expect(d.facts.filter((f) => f.a === 3 && f.b === 6)).toEqual([]);
    expect(d.rules).toEqual([]);
  });

  it('works the wrong partial product on its own: a carry not added once, a one-off slip', () => {
    const d = ok('347 x 26', '8922', { partials: ['2,082', '6840'] });
    expect(d.writtenSteps).toMatchObject({
      kind: 'partials',
      firstDiffers: 1,
      steps: [
        { label: 'partial product 1', expected: '2082', written: '2082', ok: true, finding: null },
        {
          label: 'partial product 2',
          work: '347 × 2, one place left',
          expected: '6940',
          written: '6840',
          ok: false,
          finding: { ids: ['mul.no-carry'], oneOff: true },
        },
      ],
    });
    expect(d.writtenSteps?.steps[1]?.finding?.explanation).toMatch(/carried into the tens digit/);
    expect(d.firstWrongStep?.place).toBe('partial product 2');
    expect(d.suggestedCause?.cause).toBe('slip');
  });

  it('names the rule when every partial product shows it', () => {
    // 347 × 6 with no carries: 2, 4, 18 → 1842; 347 × 2 → 684; 1842 + 6840 = 8682.
    const d = ok('347 x 26', '8682', { partials: ['1842', '6840'] });
    expect(d.rules[0]?.id).toBe('mul.no-carry');
    expect(d.writtenSteps?.steps.map((s) => s.finding?.oneOff)).toEqual([false, false]);
  });

  it('keeps a fact slip that sits in the partial product that shows it', () => {
    // 4 × 6 taken as 23: 347 × 6 → 2072; 2072 + 6940 = 9012.
    expect(2072n + 6940n).toBe(9012n);
    const d = ok('347 x 26', '9012', { partials: ['2072', '6940'] });
    expect(d.rules[0]?.id).toBe('mul.fact');
    expect(d.facts).toMatchObject([{ a: 4, b: 6, expected: 24, written: 23 }]);
    expect(d.writtenSteps?.steps[0]?.finding?.ids).toEqual(['mul.fact']);
  });

  it('says the partial products were right and the adding was not', () => {
    const d = ok('347 x 26', '9012', { partials: ['2082', '6940'] });
    expect(d.rules.map((r) => r.id)).toEqual(['mul.partials-added-wrong']);
    expect(d.writtenSteps?.firstDiffers).toBeNull();
  });

  it('refuses more partial products than the multiplier has digits (CLI exit 2)', () => {
    const d = diagnose('347 x 26', '9022', { steps: { partials: ['2082', '6940', '0'] } });
    expect(d.ok).toBe(false);
    if (d.ok) return;
    expect(d.part).toBe('steps');
    expect(d.error.message).toContain('26 has 2 digits');
    let err = '';
    const status = main(
      ['diagnose', '347 x 26', '9022', '--steps', '{"partials":["2082","6940","0"]}'],
      { write: () => undefined },
      { write: (t: string) => (err += t) },
    );
    expect(status).toBe(2);
    expect(err).toContain('partial products');
  });

  it('has no written steps when none were given', () => {
    expect(ok('347 x 26', '9022').writtenSteps).toBeNull();
  });
});

describe('written division lines', () => {
  it('compares each product and difference and marks the first that differs', () => {
    // 84 ÷ 4: 2 × 4 = 8, 8 − 8 = 0, bring down 4, 1 × 4 = 4, 4 − 4 = 0.
    const d = ok('84 ÷ 4', '21 R 1', { lines: ['8', '0', '4', '1'] });
    expect(d.writtenSteps?.kind).toBe('lines');
    expect(d.writtenSteps?.firstDiffers).toBe(3);
    expect(d.writtenSteps?.steps.map((s) => [s.label, s.expected, s.written, s.ok])).toEqual([
      ['step 1 product', '8', '8', true],
      ['step 1 difference', '0', '0', true],
      ['step 2 product', '4', '4', true],
      ['step 2 difference', '0', '1', false],
    ]);
    expect(d.writtenSteps?.steps[3]?.finding?.ids).toEqual(['sub.fact']);
  });
});
