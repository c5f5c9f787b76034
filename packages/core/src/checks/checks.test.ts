import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseAnswer } from '../parse/parseAnswer.js';
import { parseProblem } from '../parse/parseProblem.js';
import type { Answer, Problem } from '../parse/types.js';
import { readFixture } from '../testing/fixtures.js';
import { castOutElevens } from './castOutElevens.js';
import { castOutNines } from './castOutNines.js';
import { residueOf } from './residueOf.js';

const read = (p: string, a: string): [Problem, Answer] => {
  const problem = parseProblem(p);
  const answer = parseAnswer(a);
  if (!problem.ok || !answer.ok) throw new Error('unreadable');
  return [problem.problem, answer.answer];
};

interface PublishedCheck {
  problem: string;
  answer: string;
  nines: boolean;
  elevens?: boolean;
  source: string;
}
// Source: shared/reference/worked-examples.json "checks" (MathWorld "Casting Out Nines"; the
// encyclopedia article "Casting out nines"; blog posts on the nines and elevens checks; computed rows marked so).
const published = readFixture<{ checks: PublishedCheck[] }>('worked-examples.json').checks;

describe('casting out nines and elevens', () => {
  it.each(published)('$problem = $answer — $source', (ex) => {
    const [p, a] = read(ex.problem, ex.answer);
    expect(castOutNines(p, a).passes).toBe(ex.nines);
    if (ex.elevens !== undefined) expect(castOutElevens(p, a).passes).toBe(ex.elevens);
  });

  it('shows the digit sums (MathWorld: 12345 × 67890 = 838102050, both sides ≡ 0)', () => {
    const [p, a] = read('12345 x 67890', '838102050');
    const nines = castOutNines(p, a);
    if (!nines.applies) throw new Error('applies');
    expect(nines.numbers[0]).toEqual({
      number: '12345',
      working: ['1 + 2 + 3 + 4 + 5 = 15', '1 + 5 = 6'],
      residue: 6,
    });
    expect(nines.problemSide.residue).toBe(0);
    expect(nines.answerSide.residue).toBe(0);
  });

  it('a digit swap passes nines but fails elevens, and the caveat says so (321 − 235 → 68, computed)', () => {
    const [p, a] = read('321 - 235', '68');
    const nines = castOutNines(p, a);
    const elevens = castOutElevens(p, a);
    expect(nines.passes).toBe(true);
    expect(elevens.passes).toBe(false);
    if (!nines.applies) throw new Error('applies');
    expect(nines.caveat).toMatch(/does not prove/);
    expect(nines.caveat).toMatch(/swapped/);
  });

  it('warns when a remainder is not smaller than the divisor (59 ÷ 7 → 7 R 10 passes both)', () => {
    const [p, a] = read('59 ÷ 7', '7 R 10');
    const nines = castOutNines(p, a);
    if (!nines.applies) throw new Error('applies');
    expect(nines.passes).toBe(true);
    expect(nines.warnings).toHaveLength(1);
  });

  it('does not apply to rounding or fractions', () => {
    expect(castOutNines(...read('round 3456 to nearest hundred', '3500')).applies).toBe(false);
    expect(castOutElevens(...read('1/2 + 1/3', '5/6')).applies).toBe(false);
  });

  it('the residues match the arithmetic definition (n mod 9, n mod 11), property', () => {
    fc.assert(
      fc.property(fc.bigInt({ min: 0n, max: 10n ** 25n }), (n) => {
        expect(residueOf(n.toString(), 9).residue).toBe(Number(n % 9n));
        expect(residueOf(n.toString(), 11).residue).toBe(Number(n % 11n));
      }),
      { numRuns: 1000 },
    );
  }, 30_000);

  it('a check passes exactly when both sides agree mod 9 / mod 11, for + − × ÷, property', () => {
    const op = fc.constantFrom('+', '-', 'x', '÷');
    fc.assert(
      fc.property(
        op,
        fc.bigInt({ min: 1n, max: 10n ** 9n }),
        fc.bigInt({ min: 1n, max: 10n ** 6n }),
        fc.bigInt({ min: 0n, max: 10n ** 12n }),
        (o, x, y, answer) => {
          const [a, b] = o === '-' && x < y ? [y, x] : [x, y];
          const text = `${a} ${o} ${b}`;
          const q = answer % 100000n;
          const r = answer % b;
          const ans = o === '÷' ? `${q} R ${r}` : answer.toString();
          const [p, parsed] = read(text, ans);
          for (const m of [9n, 11n]) {
            const left = o === '+' ? a + b : o === '-' ? a - b : o === 'x' ? a * b : a;
            const right = o === '÷' ? q * b + r : answer;
            const check = m === 9n ? castOutNines(p, parsed) : castOutElevens(p, parsed);
            expect(check.passes).toBe((((left - right) % m) + m) % m === 0n);
          }
        },
      ),
      { numRuns: 1000 },
    );
  }, 30_000);
});
