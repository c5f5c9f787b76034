// For random problems, every rule run on the problem: when its answer differs from the
// right one, diagnose of that answer lists the rule; the right answer lists none.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { diagnose } from '../diagnose/diagnose.js';
import { parseProblem } from '../parse/parseProblem.js';
import { applyRule } from './applyRule.js';
import { RULES } from './catalog.js';

const digits = (min: number, max: number) => fc.integer({ min, max }).map(String);
const num = (len: number) =>
  fc
    .tuple(
      fc.integer({ min: 1, max: 9 }),
      fc.array(fc.constantFrom(0, 0, 1, 2, 3, 4, 5, 6, 7, 8, 9), {
        minLength: len - 1,
        maxLength: len - 1,
      }),
    )
    .map(([h, t]) => `${h}${t.join('')}`);
const size = fc.integer({ min: 1, max: 5 });

const problems: Record<string, fc.Arbitrary<string>> = {
  addition: fc.tuple(size.chain(num), size.chain(num)).map(([a, b]) => `${a} + ${b}`),
  subtraction: fc
    .tuple(size.chain(num), size.chain(num))
    .map(([a, b]) => (BigInt(a) >= BigInt(b) ? `${a} - ${b}` : `${b} - ${a}`)),
  multiplication: fc
    .tuple(size.chain(num), fc.integer({ min: 1, max: 3 }).chain(num), fc.nat(2), fc.nat(2))
    .map(([a, b, za, zb]) => `${a}${'0'.repeat(za)} x ${b}${'0'.repeat(zb)}`),
  division: fc
    .tuple(fc.integer({ min: 2, max: 6 }).chain(num), digits(2, 9))
    .map(([a, b]) => `${a} ÷ ${b}`),
  rounding: fc
    .tuple(fc.integer({ min: 2, max: 7 }).chain(num), fc.integer({ min: 1, max: 3 }))
    .map(([v, e]) => `round ${v} to the nearest ${['ten', 'hundred', 'thousand'][e - 1]}`),
  missing: fc
    .tuple(
      fc.integer({ min: 1, max: 4 }).chain(num),
      digits(1, 99),
      fc.constantFrom('+', '-', 'x', '÷'),
      fc.boolean(),
    )
    .map(([a, b, op, first]) => {
      const A = BigInt(a);
      const B = BigInt(b);
      if (op === '+') return first ? `? + ${b} = ${A + B}` : `${b} + ? = ${A + B}`;
      if (op === '-') return first ? `? - ${b} = ${a}` : `${A + B} - ? = ${a}`;
      if (op === 'x') return first ? `? x ${b} = ${A * B}` : `${b} x ? = ${A * B}`;
      return first ? `? ÷ ${b} = ${a}` : `${A * B} ÷ ? = ${a}`;
    }),
  fraction: fc
    .tuple(digits(1, 9), digits(1, 12), digits(1, 9), digits(1, 12), fc.constantFrom('+', '?'))
    .map(([a, b, c, d, op]) => `${a}/${b} ${op} ${op === '?' ? a : c}/${d}`),
  // Decimals and money: + − × and comparisons, with one to three places on either side.
  decimal: fc
    .tuple(
      fc.integer({ min: 1, max: 3 }).chain(num),
      fc.integer({ min: 1, max: 3 }).chain(num),
      fc.integer({ min: 1, max: 3 }),
      fc.integer({ min: 0, max: 3 }),
      fc.constantFrom('+', '-', 'x', '?', '?'),
      fc.boolean(),
    )
    .map(([a, b, pa, pb, op, money]) => {
      const point = (n: string, p: number) =>
        p === 0 ? n : `${n.slice(0, -p) || '0'}.${n.slice(-p).padStart(p, '0')}`;
      const x = point(a.padStart(pa + 1, '1'), pa);
      const y = point(
        op === '?' ? `${x.split('.')[0]}${b}` : b.padStart(pb + 1, '1'),
        op === '?' ? b.length : pb,
      );
      const [l, r] = op === '-' && Number(x) < Number(y) ? [y, x] : [x, y];
      const $ = money && op !== '?' && op !== 'x' ? '$' : '';
      return `${$}${l} ${op} ${$}${r}`;
    }),
  time: fc
    .tuple(
      fc.integer({ min: 1, max: 12 }),
      fc.integer({ min: 0, max: 59 }),
      fc.integer({ min: 0, max: 11 }),
      fc.integer({ min: 0, max: 59 }),
      fc.boolean(),
    )
    .map(([h1, m1, h2, m2, add]) => {
      const t = (h: number, m: number) => `${h}:${String(m).padStart(2, '0')}`;
      if (add) return `${t(h1, m1)} + ${t(h2, m2)}`;
      return h1 * 60 + m1 >= h2 * 60 + m2
        ? `${t(h1, m1)} - ${t(h2, m2)}`
        : `${t(h2, m2)} - ${t(h1, m1)}`;
    }),
};

const systematic = RULES.filter(
  (r) => r.kind === 'systematic' && r.id !== 'mul.partials-added-wrong',
);

describe('every rule, on random problems', () => {
  it.each(systematic.map((r) => [r.id, r.operation] as const))(
    '%s: diagnose of the rule’s answer lists it',
    (id, operation) => {
      let exercised = 0;
      fc.assert(
        fc.property(problems[operation] as fc.Arbitrary<string>, (text) => {
          const parsed = parseProblem(text);
          if (!parsed.ok) return;
          const right = diagnose(text, '0');
          if (!right.ok) throw new Error(text);
          for (const answer of applyRule(id, parsed.problem)) {
            if (answer === right.expected) continue;
            const d = diagnose(text, answer);
            if (!d.ok) throw new Error(`${text} → ${answer}: ${d.error.message}`);
            if (d.correct) continue; // a different form of the right value (e.g. 2/4 for 1/2)
            exercised += 1;
            expect(
              d.rules.map((r) => r.id),
              `${text} → ${answer}`,
            ).toContain(id);
          }
        }),
        { numRuns: 150 },
      );
      expect(exercised).toBeGreaterThan(0);
    },
    30_000,
  );

  it.each(Object.keys(problems))(
    '%s: the correct answer lists no rule',
    (operation) => {
      fc.assert(
        fc.property(problems[operation] as fc.Arbitrary<string>, (text) => {
          const right = diagnose(text, '0');
          if (!right.ok) return;
          const d = diagnose(text, right.expected);
          if (!d.ok) throw new Error(text);
          expect(d.correct).toBe(true);
          expect(d.rules).toEqual([]);
          expect(d.suggestedCause).toBeNull();
        }),
        { numRuns: 300 },
      );
    },
    30_000,
  );
});
