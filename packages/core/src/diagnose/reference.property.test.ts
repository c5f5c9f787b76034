// The reference workings against libraries the project did not write: big.js and
// decimal.js for whole numbers and division with remainder, fraction.js for fractions,
// decimal.js ROUND_HALF_UP for school rounding.
import Big from 'big.js';
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { readFixture } from '../testing/fixtures.js';
import { diagnose } from './diagnose.js';

const RUNS = 1000;
const whole = (max: bigint) => fc.bigInt({ min: 0n, max }).map((n) => n.toString());
const expectedOf = (p: string): string => {
  const d = diagnose(p, '0');
  if (!d.ok) throw new Error(`${p}: ${d.error.message}`);
  return d.expected;
};

describe('reference workings agree with reference libraries', () => {
  it('column addition of 2–4 addends = big.js sum', () => {
    fc.assert(
      fc.property(fc.array(whole(10n ** 20n), { minLength: 2, maxLength: 4 }), (xs) => {
        const sum = xs.reduce((s, x) => s.plus(x), new Big(0));
        expect(expectedOf(xs.join(' + '))).toBe(sum.toFixed(0));
      }),
      { numRuns: RUNS },
    );
  }, 30_000);

  it('column subtraction = big.js difference', () => {
    fc.assert(
      fc.property(whole(10n ** 20n), whole(10n ** 20n), (x, y) => {
        const [a, b] = new Big(x).gte(y) ? [x, y] : [y, x];
        expect(expectedOf(`${a} - ${b}`)).toBe(new Big(a).minus(b).toFixed(0));
      }),
      { numRuns: RUNS },
    );
  }, 30_000);

  it('long multiplication = decimal.js product', () => {
    fc.assert(
      fc.property(whole(10n ** 12n), whole(10n ** 8n), (a, b) => {
        expect(expectedOf(`${a} x ${b}`)).toBe(new Decimal(a).times(b).toFixed(0));
      }),
      { numRuns: RUNS },
    );
  }, 30_000);

  it('long division = big.js quotient and remainder', () => {
    fc.assert(
      fc.property(
        whole(10n ** 15n - 1n),
        fc.bigInt({ min: 1n, max: 10n ** 6n }).map(String),
        (a, b) => {
          Big.DP = 40;
          const q = new Big(a).div(b).round(0, Big.roundDown);
          const r = new Big(a).minus(q.times(b));
          expect(expectedOf(`${a} ÷ ${b}`)).toBe(
            r.eq(0) ? q.toFixed(0) : `${q.toFixed(0)} R ${r.toFixed(0)}`,
          );
        },
      ),
      { numRuns: RUNS },
    );
  }, 30_000);

  it('fractions: sums, differences and comparisons = fraction.js', () => {
    const frac = fc.record({
      n: fc.integer({ min: 0, max: 50 }),
      d: fc.integer({ min: 1, max: 60 }),
    });
    fc.assert(
      fc.property(frac, frac, fc.constantFrom('+', '-', '?'), (x, y, op) => {
        const fx = new Fraction(x.n, x.d);
        const fy = new Fraction(y.n, y.d);
        if (op === '-' && fx.compare(fy) < 0) return;
        const got = expectedOf(`${x.n}/${x.d} ${op} ${y.n}/${y.d}`);
        if (op === '?') expect(got).toBe(['<', '=', '>'][fx.compare(fy) + 1]);
        else expect(got).toBe((op === '+' ? fx.add(fy) : fx.sub(fy)).toFraction());
      }),
      { numRuns: RUNS },
    );
  }, 30_000);

  it('rounding = decimal.js toNearest with ROUND_HALF_UP', () => {
    const names = ['ten', 'hundred', 'thousand', 'ten thousand', 'hundred thousand', 'million'];
    fc.assert(
      fc.property(whole(10n ** 12n), fc.integer({ min: 1, max: 6 }), (v, e) => {
        const want = new Decimal(v)
          .toNearest(new Decimal(10).pow(e), Decimal.ROUND_HALF_UP)
          .toFixed(0);
        expect(expectedOf(`round ${v} to the nearest ${names[e - 1]}`)).toBe(want);
      }),
      { numRuns: RUNS },
    );
  }, 30_000);

  // Source: shared/reference/worked-examples.json "rounding" (decimal.js / big.js modes; ISO 80000-1 Annex B rule A).
  const ties = readFixture<{
    rounding: {
      value: number;
      place: number;
      schoolHalfUp: number;
      halfEven: number;
      source: string;
    }[];
  }>('worked-examples.json').rounding;
  it.each(ties)(
    'rounds $value to the nearest $place half-up ($schoolHalfUp), not half-even ($halfEven) — $source',
    (t) => {
      const name = { 10: 'ten', 100: 'hundred', 1000: 'thousand' }[t.place] as string;
      expect(expectedOf(`round ${t.value} to the nearest ${name}`)).toBe(String(t.schoolHalfUp));
      expect(new Decimal(t.value).toNearest(t.place, Decimal.ROUND_HALF_UP).toNumber()).toBe(
        t.schoolHalfUp,
      );
      expect(new Decimal(t.value).toNearest(t.place, Decimal.ROUND_HALF_EVEN).toNumber()).toBe(
        t.halfEven,
      );
      expect(new Big(t.value).round(-Math.log10(t.place), Big.roundHalfUp).toNumber()).toBe(
        t.schoolHalfUp,
      );
    },
  );

  it('3450 to the nearest hundred: school 3500, half-even 3400 (reference README)', () => {
    expect(expectedOf('round 3450 to the nearest hundred')).toBe('3500');
    expect(new Decimal(3450).toNearest(100, Decimal.ROUND_HALF_EVEN).toNumber()).toBe(3400);
  });

  it('missing numbers: the filled-in equation holds (big.js)', () => {
    fc.assert(
      fc.property(
        whole(10n ** 9n),
        fc.bigInt({ min: 1n, max: 999n }).map(String),
        fc.constantFrom('+', '-', 'x', '÷'),
        fc.boolean(),
        (a, b, op, blankFirst) => {
          const A = new Big(a);
          const B = new Big(b);
          const c = op === '+' ? A.plus(B) : op === '-' ? A.plus(B) : op === 'x' ? A.times(B) : A;
          const left = op === '÷' ? A.times(B) : A;
          // Build an equation whose blank is a (or b).
          const eq =
            op === '-'
              ? blankFirst
                ? `? - ${b} = ${a}`
                : `${c.toFixed(0)} - ? = ${a}`
              : op === '÷'
                ? blankFirst
                  ? `? ÷ ${b} = ${a}`
                  : `${left.toFixed(0)} ÷ ? = ${a === '0' ? '1' : a}`
                : blankFirst
                  ? `? ${op} ${b} = ${c.toFixed(0)}`
                  : `${b} ${op} ? = ${c.toFixed(0)}`;
          if (op === '÷' && !blankFirst && a === '0') return;
          const got = expectedOf(eq);
          if (op === '-') expect(got).toBe(blankFirst ? c.toFixed(0) : B.toFixed(0));
          else if (op === '÷') expect(got).toBe(blankFirst ? A.times(B).toFixed(0) : B.toFixed(0));
          else expect(got).toBe(A.toFixed(0));
        },
      ),
      { numRuns: RUNS },
    );
  }, 30_000);
});
