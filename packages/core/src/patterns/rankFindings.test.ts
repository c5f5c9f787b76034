import { describe, expect, it } from 'vitest';
import { rankFindings } from './rankFindings.js';
import { missOf } from './testMisses.js';

// What each rule writes is worked out by hand from DESIGN.md's rule definitions
// (304 − 75 → 139 is the catalog's own example of sub.borrow-across-zero).
const w10 = '2026-03-02';
const w11 = '2026-03-10';
const w12 = '2026-03-17';

describe('rankFindings', () => {
  const twoBorrows = [
    missOf(w10, '304 - 75', '139', { id: 1 }),
    missOf(w11, '605 - 48', '467', { id: 2 }), // skips the 0: 15 − 8, tens 0 regroups from 5 → 4 … = 467
    missOf(w11, '81 - 38', '57', { id: 3 }), // sub.smaller-from-larger
  ];

  it('makes a finding of a rule that explains 2 misses and no right item contradicts', () => {
    const { rules } = rankFindings(twoBorrows, [
      { occurredOn: w10, problem: '84 - 21', answer: '63' }, // no regrouping: the rule writes 63 too
      { occurredOn: w10, problem: '27 + 15', answer: '42' }, // the rule does not apply
    ]);
    expect(rules[0]).toMatchObject({
      ruleId: 'sub.borrow-across-zero',
      status: 'finding',
      explains: 2,
      contradictions: [],
      score: 2,
      group: 'zero-regrouping',
    });
    expect(rules[0]!.evidence.map((e) => e.missId)).toEqual([1, 2]);
    expect(rules[1]).toMatchObject({
      ruleId: 'sub.smaller-from-larger',
      status: 'possible',
      explains: 1,
    });
  });

  it('lowers a rule that would have broken an item the child got right', () => {
    const { rules } = rankFindings(twoBorrows, [
      // 503 − 27 with the zero skipped: 13 − 7 = 6, tens 0 regroups from 4 → 3: 10 − 2 = 8 → 386.
      { occurredOn: w12, problem: '503 - 27', answer: '476' },
    ]);
    const rule = rules.find((r) => r.ruleId === 'sub.borrow-across-zero')!;
    expect(rule).toMatchObject({
      status: 'possible',
      score: 1,
      contradictions: [{ occurredOn: w12, problem: '503 − 27', answer: '476', ruleWrites: '386' }],
    });
    // 81 − 38 → 57 only reproduces one miss, but it is not contradicted: it still ranks below.
    expect(rules.map((r) => r.ruleId)).toEqual([
      'sub.borrow-across-zero',
      'sub.smaller-from-larger',
    ]);
  });

  it('never weighs fact rules and counts rules seen only in a pair apart', () => {
    const pair = {
      ...missOf(w10, '52 - 17', '45', { id: 7 }),
      // Made by hand: a pair of rules as a diagnosis reports it.
      diagnosis: {
        rules: [
          {
            id: 'sub.borrow-no-decrement+sub.zero-minus-n-is-n',
            ids: ['sub.borrow-no-decrement', 'sub.zero-minus-n-is-n'],
          },
        ],
        facts: [],
      },
    };
    const { rules } = rankFindings([pair, missOf(w10, '7 x 8', '54', { id: 8 })]);
    expect(rules.map((r) => [r.ruleId, r.explains, r.inPairs])).toEqual([
      ['sub.borrow-no-decrement', 0, 1],
      ['sub.zero-minus-n-is-n', 0, 1],
    ]);
  });

  it('groups related zero-regrouping rules seen in different weeks', () => {
    const { groups } = rankFindings([
      missOf(w10, '304 - 75', '139', { id: 1 }),
      missOf(w12, '40 - 13', '30', { id: 2 }), // 0 − 3 written as 0: sub.zero-minus-n-is-zero
    ]);
    expect(groups).toHaveLength(1);
    expect(groups[0]).toMatchObject({
      group: 'zero-regrouping',
      title: 'Regrouping across zeros',
      ruleIds: ['sub.borrow-across-zero', 'sub.zero-minus-n-is-zero'],
      weeks: ['2026-W10', '2026-W12'],
      status: 'finding',
    });
    expect(groups[0]!.evidence.map((e) => e.missId)).toEqual([1, 2]);
  });

  it('does not group them within one week, nor one rule alone', () => {
    expect(
      rankFindings([
        missOf(w10, '304 - 75', '139', { id: 1 }),
        missOf(w10, '40 - 13', '30', { id: 2 }),
      ]).groups,
    ).toEqual([]);
    expect(
      rankFindings([
        missOf(w10, '304 - 75', '139', { id: 1 }),
        missOf(w12, '304 - 75', '139', { id: 2 }),
      ]).groups,
    ).toEqual([]);
  });

  it('holds a group back only for a right item every rule of it would have broken', () => {
    const misses = [
      missOf(w10, '304 - 75', '139', { id: 1 }),
      missOf(w12, '40 - 13', '30', { id: 2 }),
    ];
    // 503 − 27: only the zero-skipping rule breaks it (386); 0 − N → 0 never meets a 0 − N column.
    expect(
      rankFindings(misses, [{ occurredOn: w12, problem: '503 - 27', answer: '476' }]).groups[0]!
        .status,
    ).toBe('finding');
    // 400 − 13: zero-skipping writes 297, 0 − N → 0 writes 400; the child wrote 387.
    const held = rankFindings(misses, [{ occurredOn: w12, problem: '400 - 13', answer: '387' }]);
    expect(held.groups[0]).toMatchObject({
      status: 'possible',
      contradictions: [{ problem: '400 − 13', ruleWrites: '297' }],
    });
    expect(
      held.rules.find((r) => r.ruleId === 'sub.zero-minus-n-is-zero')!.contradictions[0]!
        .ruleWrites,
    ).toBe('400');
  });
});
