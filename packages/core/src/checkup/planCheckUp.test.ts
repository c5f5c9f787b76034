import { describe, expect, it } from 'vitest';
import { diagnose } from '../diagnose/diagnose.js';
import { parseProblem } from '../parse/parseProblem.js';
import { applyRule } from '../rules/applyRule.js';
import { RULES } from '../rules/catalog.js';
import { identificationRate } from './identificationRate.js';
import { planCheckUp } from './planCheckUp.js';
import { readCheckUp } from './readCheckUp.js';
import { RIGHT_WORKING } from './types.js';

const methodRules = (operation: string): string[] =>
  RULES.filter(
    (r) =>
      r.operation === operation && r.kind === 'systematic' && r.id !== 'mul.partials-added-wrong',
  ).map((r) => r.id);

const OPERATIONS = [
  'addition',
  'subtraction',
  'multiplication',
  'division',
  'rounding',
  'missing',
  'fraction',
  'decimal',
  'time',
];

/** Every pair of rules of one operation, as [a, b]. */
const pairsOf = (operation: string): [string, string][] => {
  const ids = methodRules(operation);
  return ids.flatMap((a, i) => ids.slice(i + 1).map((b): [string, string] => [a, b]));
};

/** How many problems give the two hypotheses different answers, counted from the sheet itself. */
const differences = (
  problems: readonly { answers: Readonly<Record<string, string>> }[],
  a: string,
  b: string,
): number => problems.filter((p) => p.answers[a] !== p.answers[b]).length;

describe('planCheckUp', () => {
  it('makes 4–6 problems that tell two regrouping habits and the right working apart', () => {
    const plan = planCheckUp(['sub.borrow-across-zero', 'sub.borrow-from-zero'], {
      digits: 4,
      seed: 1,
    });
    expect(plan.ok).toBe(true);
    if (!plan.ok) return;
    expect(plan.operation).toBe('subtraction');
    expect(plan.hypotheses).toEqual([
      RIGHT_WORKING,
      'sub.borrow-across-zero',
      'sub.borrow-from-zero',
    ]);
    expect(plan.problems.length).toBeGreaterThanOrEqual(4);
    expect(plan.problems.length).toBeLessThanOrEqual(6);
    for (const p of plan.problems) {
      expect(Object.keys(p.answers).sort()).toEqual([...plan.hypotheses].sort());
      // The right answers by plain arithmetic, not by the engine.
      const [top, bottom] = p.problem.split(' − ').map((n) => BigInt(n));
      expect(p.answers[RIGHT_WORKING]).toBe(String((top as bigint) - (bottom as bigint)));
    }
    expect(plan.unseparated).toEqual([]);
  });

  it('gives the same sheet for the same seed, and another for another seed', () => {
    const a = planCheckUp(['add.no-carry', 'add.writes-carry'], { seed: 5 });
    const b = planCheckUp(['add.no-carry', 'add.writes-carry'], { seed: 5 });
    const c = planCheckUp(['add.no-carry', 'add.writes-carry'], { seed: 6 });
    expect(a).toEqual(b);
    expect(a).not.toEqual(c);
  });

  it('keeps to the child’s size when the habits show there', () => {
    const plan = planCheckUp(['add.no-carry', 'add.carry-reversed'], { digits: 2, seed: 2 });
    expect(plan.ok).toBe(true);
    if (!plan.ok) return;
    for (const p of plan.problems)
      for (const n of p.problem.split(' + ')) expect(n.length).toBeLessThanOrEqual(2);
  });

  it('folds a fact rule into the right working: a one-off slip has no fixed wrong answer', () => {
    const plan = planCheckUp(['sub.fact', 'sub.smaller-from-larger'], { seed: 1 });
    expect(plan.ok).toBe(true);
    if (!plan.ok) return;
    expect(plan.hypotheses).toEqual([RIGHT_WORKING, 'sub.smaller-from-larger']);
    expect(plan.merged.map((m) => m.id)).toEqual(['sub.fact']);
  });

  it('refuses what it cannot plan, saying why', () => {
    const unknown = planCheckUp(['sub.borrow-sideways']);
    expect(unknown).toEqual({
      ok: false,
      error: { message: '“sub.borrow-sideways” is not a rule in the catalog.' },
    });
    const mixed = planCheckUp(['add.no-carry', 'sub.smaller-from-larger']);
    expect(mixed.ok).toBe(false);
    if (!mixed.ok) expect(mixed.error.message).toContain('one operation');
    const facts = planCheckUp(['mul.fact']);
    expect(facts.ok).toBe(false);
    expect(planCheckUp([]).ok).toBe(false);
  });

  describe.each(OPERATIONS)('every pair of %s rules', (operation) => {
    it.each(pairsOf(operation))(
      '%s and %s are told apart at least twice',
      (a, b) => {
        for (const seed of [1, 2]) {
          const plan = planCheckUp([a, b], { seed });
          expect(plan.ok, `${a} ${b} seed ${seed}`).toBe(true);
          if (!plan.ok) return;
          expect(plan.problems.length).toBeGreaterThanOrEqual(4);
          expect(plan.problems.length).toBeLessThanOrEqual(6);
          const h = plan.hypotheses;
          for (let i = 0; i < h.length; i += 1)
            for (let j = i + 1; j < h.length; j += 1)
              expect(
                differences(plan.problems, h[i] as string, h[j] as string),
                `${h[i]} vs ${h[j]} (seed ${seed})`,
              ).toBeGreaterThanOrEqual(2);
          for (const p of plan.problems) {
            const parsed = parseProblem(p.problem);
            expect(parsed.ok).toBe(true);
            if (!parsed.ok) return;
            for (const id of [a, b]) {
              const answer = p.answers[id] as string;
              if (answer === p.answers[RIGHT_WORKING]) continue;
              // The sheet's answer is the rule's own method, and the notebook names that rule.
              expect(applyRule(id, parsed.problem)).toContain(answer);
              const d = diagnose(p.problem, answer);
              if (!d.ok) throw new Error(d.error.message);
              const first = d.rules[0]?.id as string;
              expect(p.answers[first], `${p.problem} → ${answer}`).toBe(answer);
              if (differences([p], a, b) === 1 && p.answers[a] !== p.answers[b])
                expect(first === a || first === b).toBe(true);
            }
          }
        }
      },
      30_000,
    );
  });
});

describe('readCheckUp', () => {
  const plan = planCheckUp(['sub.borrow-across-zero', 'sub.smaller-from-larger'], {
    digits: 3,
    seed: 4,
  });
  if (!plan.ok) throw new Error(plan.error.message);
  const answersOf = (id: string): string[] => plan.problems.map((p) => p.answers[id] as string);

  it('confirms the working the child followed and rules out the rest', () => {
    const reading = readCheckUp(plan, answersOf('sub.borrow-across-zero'));
    expect(reading.verdict).toBe('confirmed');
    expect(reading.confirmed).toBe('sub.borrow-across-zero');
    expect([...reading.ruledOut].sort()).toEqual([RIGHT_WORKING, 'sub.smaller-from-larger'].sort());
  });

  it('still confirms after one slip, and reads answers as a child writes them', () => {
    const answers = answersOf(RIGHT_WORKING);
    answers[0] = `${answers[0]}7`; // a slip no working writes
    answers[1] = ` ${Number(answers[1]).toLocaleString('en-US')} `;
    const reading = readCheckUp(plan, answers);
    expect(reading.confirmed).toBe(RIGHT_WORKING);
  });

  it('stays open when the answers mix two workings', () => {
    const mixed = plan.problems.map((p, i) =>
      i % 2 === 0
        ? (p.answers['sub.borrow-across-zero'] as string)
        : (p.answers['sub.smaller-from-larger'] as string),
    );
    const reading = readCheckUp(plan, mixed);
    expect(reading.verdict).toBe('open');
    expect(reading.confirmed).toBeNull();
  });

  it('counts blank answers for nothing', () => {
    const reading = readCheckUp(
      plan,
      plan.problems.map(() => null),
    );
    expect(reading.verdict).toBe('open');
    expect(reading.scores.every((s) => s.matches === 0 && s.misses === 0)).toBe(true);
  });
});

describe('a simulated child is named after one sheet', () => {
  // 1,000 seeded trials per operation; each child follows one hypothesis and slips on any one
  // problem with probability 0.05. The figures are printed by `npm run bench -w packages/core`.
  it.each(OPERATIONS)(
    '%s: in at least 95% of 1,000 trials',
    (operation) => {
      const result = identificationRate(operation, { trials: 1000, slipRate: 0.05, seed: 2026 });
      expect(result.trials).toBe(1000);
      expect(result.rate).toBeGreaterThanOrEqual(0.95);
    },
    60_000,
  );
});
