import { describe, expect, it } from 'vitest';
import { findRecurring } from './findRecurring.js';
import { missOf } from './testMisses.js';

// 304 − 75 → 139 is DESIGN.md's example of sub.borrow-across-zero; 7 × 8 → 54 a wrong fact.
const borrow = (date: string, id: number) => missOf(date, '304 - 75', '139', { id });
const key = 'rule:sub.borrow-across-zero';

describe('findRecurring: 3 or more within 30 days', () => {
  it('finds 3 misses whose first and last are 30 calendar days apart, both ends counted', () => {
    const found = findRecurring([
      borrow('2026-03-01', 1),
      borrow('2026-03-15', 2),
      borrow('2026-03-30', 3),
    ]);
    expect(found.map((p) => p.key)).toEqual([key]);
    expect(found[0]).toMatchObject({
      kind: 'rule',
      id: 'sub.borrow-across-zero',
      label: 'Zeros skipped when regrouping',
      count: 3,
      window: { from: '2026-03-01', to: '2026-03-30', count: 3 },
      status: 'not-reviewed',
      sincePlan: null,
      missIds: [1, 2, 3],
    });
    expect(found[0]!.sentence).toBe(
      '3 misses from 2026-03-01 to 2026-03-30 show “Zeros skipped when regrouping”. No review plan has covered it yet.',
    );
  });

  it('does not count 3 misses spread over 31 days', () => {
    expect(
      findRecurring([borrow('2026-03-01', 1), borrow('2026-03-15', 2), borrow('2026-03-31', 3)]),
    ).toEqual([]);
  });

  it('does not count 2 misses however close', () => {
    expect(findRecurring([borrow('2026-03-01', 1), borrow('2026-03-01', 2)])).toEqual([]);
  });

  it('slides the window: 3 of 4 misses inside 30 days is enough, and reports the busiest', () => {
    const found = findRecurring([
      borrow('2026-01-01', 1),
      borrow('2026-02-20', 2),
      borrow('2026-03-01', 3),
      borrow('2026-03-10', 4),
    ]);
    expect(found[0]).toMatchObject({
      count: 4,
      window: { from: '2026-02-20', to: '2026-03-10', count: 3 },
    });
  });

  it('finds fact families and skills too, naming the facts', () => {
    const found = findRecurring([
      missOf('2026-03-02', '7 x 8', '54', { id: 1, skills: ['times-tables'] }),
      missOf('2026-03-04', '6 x 7', '41', { id: 2, skills: ['times-tables'] }),
      missOf('2026-03-06', '7 x 8', '58', { id: 3, skills: ['times-tables'] }),
    ]);
    expect(found.map((p) => p.key).sort()).toEqual(['fact:x7', 'skill:times-tables']);
    const sevens = found.find((p) => p.key === 'fact:x7')!;
    expect(sevens.sentence).toContain('(7 × 8, 6 × 7)');
    expect(sevens.label).toBe('× and ÷ facts with 7');
  });

  it('takes the window and the count as options', () => {
    const misses = [borrow('2026-03-01', 1), borrow('2026-03-08', 2)];
    expect(findRecurring(misses, { minCount: 2, windowDays: 8 })).toHaveLength(1);
    expect(findRecurring(misses, { minCount: 2, windowDays: 7 })).toHaveLength(0);
  });
});

describe('findRecurring: fading since the last plan that covered it', () => {
  const three = [borrow('2026-03-01', 1), borrow('2026-03-15', 2), borrow('2026-03-30', 3)];
  const plan = { id: 9, scheduledFor: '2026-03-30', covers: [key] };

  it('has faded when nothing after the plan’s day shows it (a miss on that day is before it)', () => {
    const [p] = findRecurring(three, { plans: [plan] });
    expect(p).toMatchObject({
      status: 'faded',
      sincePlan: { planId: 9, scheduledFor: '2026-03-30', seenAgain: 0, lastSeen: null },
    });
    expect(p!.sentence).toContain('Not seen since the review of 2026-03-30.');
  });

  it('is seen again after a miss on the day after the plan', () => {
    const [p] = findRecurring([...three, borrow('2026-03-31', 4)], { plans: [plan] });
    expect(p).toMatchObject({
      status: 'seen-again',
      sincePlan: { seenAgain: 1, lastSeen: '2026-03-31' },
    });
    expect(p!.sentence).toContain('Seen once since the review of 2026-03-30.');
  });

  it('ignores plans that did not cover it, and plans not yet held', () => {
    const other = { id: 3, scheduledFor: '2026-03-20', covers: ['fact:x7'] };
    expect(findRecurring(three, { plans: [other] })[0]!.status).toBe('not-reviewed');
    expect(findRecurring(three, { plans: [plan], asOf: '2026-03-29' })[0]!.status).toBe(
      'not-reviewed',
    );
    expect(findRecurring(three, { plans: [plan], asOf: '2026-03-30' })[0]!.status).toBe('faded');
  });

  it('judges by the latest covering plan', () => {
    const early = { id: 2, scheduledFor: '2026-03-10', covers: [key] };
    const [p] = findRecurring([...three, borrow('2026-04-02', 4)], {
      plans: [plan, early, { id: 12, scheduledFor: '2026-04-05', covers: [key] }],
    });
    expect(p).toMatchObject({ status: 'faded', sincePlan: { planId: 12 } });
  });

  it('lists what is still active before what has faded', () => {
    const facts = [
      missOf('2026-03-02', '7 x 8', '54', { id: 11 }),
      missOf('2026-03-03', '7 x 8', '54', { id: 12 }),
      missOf('2026-03-04', '7 x 8', '54', { id: 13 }),
    ];
    const keys = findRecurring([...three, ...facts], { plans: [plan] }).map((p) => p.key);
    expect(keys).toEqual(['fact:x7', 'fact:x8', key]);
  });
});
