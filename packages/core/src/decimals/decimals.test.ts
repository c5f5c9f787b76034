import { Decimal } from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { diagnose } from '../diagnose/diagnose.js';
import { parseAnswer } from '../parse/parseAnswer.js';
import { parseProblem } from '../parse/parseProblem.js';
import { seededRandom } from '../practice/seededRandom.js';

const ok = (problem: string, answer: string) => {
  const d = diagnose(problem, answer);
  if (!d.ok) throw new Error(`${problem} → ${answer}: ${d.error.message}`);
  return d;
};

describe('decimals and money', () => {
  it('lines up the points and works the columns (DESIGN examples)', () => {
    expect(ok('4.5 + 2.25', '6.75')).toMatchObject({ expected: '6.75', correct: true });
    expect(ok('12.50 - 3.75', '8.75')).toMatchObject({ expected: '8.75', correct: true });
    expect(ok('0.3 x 0.2', '0.06')).toMatchObject({ expected: '0.06', correct: true });
    const trace = ok('4.5 + 2.25', '6.75').trace.expected;
    expect(trace).toMatchObject({ kind: 'column-addition', point: 2, result: '675' });
  });

  it('keeps the column rules under their own ids once the points are lined up', () => {
    // DESIGN.md, issue 16: 12.50 − 3.75 answered 19.85 is sub.borrow-no-decrement.
    const d = ok('12.50 - 3.75', '19.85');
    expect(d.rules[0]?.id).toBe('sub.borrow-no-decrement');
    expect(d.rules[0]?.explanation).toContain('hundredths column');
    expect(d.rules[0]?.explanation).not.toContain('1250');
    expect(d.firstWrongStep?.place).toBe('tenths');
  });

  it('finds a one-off fact slip in a column, as for whole numbers', () => {
    const d = ok('2.35 x 4', '9.3');
    expect(d.rules[0]?.id).toBe('mul.fact');
    expect(d.facts[0]).toMatchObject({ op: 'x', a: 3, b: 4, expected: 12, written: 11 });
  });

  it('reads money with or without the $, and writes it with two places', () => {
    expect(ok('$12.50 - $3.75', '$8.75')).toMatchObject({ expected: '8.75', correct: true });
    expect(ok('$12.50 - $3.75', '8.75').correct).toBe(true);
    expect(ok('$5 - $1.25', '3.75')).toMatchObject({ expected: '3.75', correct: true });
    expect(ok('$2.50 + $1.50', '$4.00')).toMatchObject({ expected: '4.00', correct: true });
    expect(ok('$2.50 + $1.50', '4').correct).toBe(true);
  });

  it('treats trailing zeros after the point as the same value', () => {
    expect(ok('1.25 + 1.75', '3.00').correct).toBe(true);
    expect(ok('1.25 + 1.75', '3').correct).toBe(true);
  });

  it.each([
    ['4.5 + 2.25', '2.70', 'dec.right-aligned'],
    ['4.5 + 2.25', '675', 'dec.point-dropped'],
    ['0.45 ? 0.5', '>', 'dec.longer-is-larger'],
    ['0.4 ? 0.45', '>', 'dec.shorter-is-larger'],
    ['0.3 × 0.2', '0.6', 'dec.point-as-in-addition'],
  ])('%s → %s is %s (DESIGN.md)', (problem, answer, rule) => {
    const d = ok(problem, answer);
    expect(d.correct).toBe(false);
    expect(d.rules[0]?.id).toBe(rule);
  });

  // Decimal-comparison item types after Resnick et al. (1989) and Steinle & Stacey's decimal
  // comparison tasks: the pairs and which misconception picks the wrong one are from memory.
  it.each([
    ['0.5 ? 0.45', '<', 'dec.longer-is-larger'],
    ['4.08 ? 4.7', '>', 'dec.longer-is-larger'],
    ['0.3 ? 0.31', '>', 'dec.shorter-is-larger'],
    ['2.6 ? 2.75', '>', 'dec.shorter-is-larger'],
  ])('comparison item %s answered %s fits %s (from memory)', (problem, answer, rule) => {
    const d = ok(problem, answer);
    expect(d.correct).toBe(false);
    expect(d.rules.map((r) => r.id)).toEqual([rule]);
  });

  it('refuses what it cannot read, naming it', () => {
    for (const text of ['3.5 - 4.25', '$2.50 x $3', '1.2345678 + 1', '$0.5 ? $0.45']) {
      const p = parseProblem(text);
      expect(p.ok, text).toBe(false);
    }
    expect(parseAnswer('$').ok).toBe(false);
    expect(parseAnswer('$8.75')).toMatchObject({
      ok: true,
      answer: { kind: 'decimal', text: '8.75' },
    });
  });

  it('agrees with decimal.js on 100,000 random problems', () => {
    // Outside check: decimal.js (exact decimal arithmetic) gives the expected answer.
    const random = seededRandom(16);
    const number = () => {
      const whole = String(Math.floor(random() * 10 ** (1 + Math.floor(random() * 4))));
      const places = Math.floor(random() * 4);
      const decimals = Array.from({ length: places }, () => Math.floor(random() * 10)).join('');
      return places === 0 ? whole : `${whole}.${decimals}`;
    };
    let checked = 0;
    for (let i = 0; i < 100_000; i += 1) {
      const a = number();
      const b = number();
      if (!a.includes('.') && !b.includes('.')) continue;
      const op = ['+', '-', 'x'][i % 3] as '+' | '-' | 'x';
      const [x, y] = op === '-' && new Decimal(a).lt(b) ? [b, a] : [a, b];
      const exact =
        op === '+'
          ? new Decimal(x).plus(y)
          : op === '-'
            ? new Decimal(x).minus(y)
            : new Decimal(x).times(y);
      const text = `${x} ${op} ${y}`;
      const d = diagnose(text, exact.toFixed());
      if (!d.ok) throw new Error(`${text}: ${d.error.message}`);
      if (!d.correct || !new Decimal(d.expected).eq(exact))
        throw new Error(`${text}: engine ${d.expected}, decimal.js ${exact.toFixed()}`);
      checked += 1;
    }
    expect(checked).toBeGreaterThan(60_000);
  }, 120_000);
});
