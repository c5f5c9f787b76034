import { describe, expect, it } from 'vitest';
import { causeMixByWeek } from './causeMixByWeek.js';
import { computePatterns } from './computePatterns.js';
import { countRules } from './countRules.js';
import { countSkills } from './countSkills.js';
import { factFamiliesOf } from './factFamiliesOf.js';
import { factGaps } from './factGaps.js';
import { patternKeysOf } from './patternKeysOf.js';
import { missOf } from './testMisses.js';

// The problems and what each rule writes are DESIGN.md's catalog examples; the counts are
// worked out by hand from the lists below.

describe('causeMixByWeek', () => {
  it('counts misses per ISO week by cause and lists the quiet weeks between as zeros', () => {
    const mix = causeMixByWeek([
      { occurredOn: '2026-03-02', cause: 'fact' }, // Monday of W10
      { occurredOn: '2026-03-08', cause: 'slip' }, // Sunday of W10
      { occurredOn: '2026-03-09', cause: 'fact' }, // Monday of W11
      { occurredOn: '2026-03-25', cause: 'step' }, // W13
    ]);
    expect(mix.map((w) => [w.week, w.total])).toEqual([
      ['2026-W10', 2],
      ['2026-W11', 1],
      ['2026-W12', 0],
      ['2026-W13', 1],
    ]);
    expect(mix[0]!.causes).toEqual({
      slip: 1,
      fact: 1,
      concept: 0,
      step: 0,
      reading: 0,
      copying: 0,
      unsure: 0,
    });
    expect(mix[0]).toMatchObject({ from: '2026-03-02', to: '2026-03-08' });
  });

  it('spans the asked range even without misses at its ends, and nothing for no range', () => {
    const mix = causeMixByWeek([{ occurredOn: '2026-03-10', cause: 'concept' }], {
      from: '2026-03-01',
      to: '2026-03-16',
    });
    expect(mix.map((w) => w.week)).toEqual(['2026-W09', '2026-W10', '2026-W11', '2026-W12']);
    expect(causeMixByWeek([])).toEqual([]);
  });
});

describe('countRules and countSkills', () => {
  it('ranks rules by misses, with first and last day, each rule of a pair counted', () => {
    const misses = [
      missOf('2026-03-02', '304 - 75', '139', { id: 1 }), // sub.borrow-across-zero
      missOf('2026-03-09', '81 - 38', '57', { id: 2 }), // sub.smaller-from-larger
      missOf('2026-03-16', '605 - 48', '467', { id: 3 }), // borrow-across-zero, computed by hand
      missOf('2026-03-20', '40 - 13', '33', { id: 4 }), // smaller-from-larger or zero-minus-n-is-n
    ];
    const rules = countRules(misses);
    expect(rules.map((r) => [r.ruleId, r.count])).toEqual([
      ['sub.smaller-from-larger', 2],
      ['sub.borrow-across-zero', 2],
      ['sub.zero-minus-n-is-n', 1],
    ]);
    expect(rules[1]).toMatchObject({
      title: 'Zeros skipped when regrouping',
      kind: 'systematic',
      firstSeen: '2026-03-02',
      lastSeen: '2026-03-16',
      missIds: [1, 3],
    });
  });

  it('ranks skills by misses, a skill named twice on one miss counted once', () => {
    const skills = countSkills([
      missOf('2026-03-02', '304 - 75', '139', { id: 1, skills: ['regrouping', 'regrouping'] }),
      missOf('2026-03-03', '7 x 8', '54', { id: 2, skills: ['times-tables'] }),
      missOf('2026-03-04', '81 - 38', '57', { id: 3, skills: ['regrouping'] }),
    ]);
    expect(skills.map((s) => [s.skill, s.count, s.missIds])).toEqual([
      ['regrouping', 2, [1, 3]],
      ['times-tables', 1, [2]],
    ]);
  });
});

describe('factGaps', () => {
  const misses = [
    missOf('2026-03-02', '7 x 8', '54', { id: 1 }),
    missOf('2026-03-05', '8 x 7', '54', { id: 2 }),
    missOf('2026-03-06', '15 - 8', '6', { id: 3 }),
    missOf('2026-03-07', '56 / 7', '9', { id: 4 }),
    {
      // Made by hand: a fact beyond the grid, as a diagnosis could report it.
      ...missOf('2026-03-08', '3 x 4', '13', { id: 5 }),
      diagnosis: {
        rules: [],
        facts: [{ op: 'x' as const, a: 12, b: 3, expected: 36, written: 38 }],
      },
    },
  ];
  const gaps = factGaps(misses);

  it('fills a fact and its turnaround as one fact', () => {
    // 7 × 8 (miss 1), 8 × 7 (miss 2) and 56 ÷ 7 = 8 (miss 4) are all the fact 7 × 8.
    expect(gaps.multiplication[7]![8]).toBe(3);
    expect(gaps.multiplication[8]![7]).toBe(3);
    expect(gaps.multiplication.flat().reduce((a, b) => a + b, 0)).toBe(6);
  });

  it('counts a subtraction fact in the addition grid as the fact it undoes', () => {
    // 15 − 8 = 7 is 8 + 7.
    expect(gaps.addition[8]![7]).toBe(1);
    expect(gaps.addition[7]![8]).toBe(1);
    expect(gaps.addition.flat().reduce((a, b) => a + b, 0)).toBe(2);
  });

  it('keeps facts beyond 10 in the list but not in the grid', () => {
    const twelve = gaps.list.find((f) => f.text === '12 × 3');
    expect(twelve).toMatchObject({
      count: 1,
      expected: 36,
      written: [38],
      families: ['x3', 'x12'],
    });
    expect(gaps.multiplication.length).toBe(11);
    expect(gaps.multiplication.every((row) => row.length === 11)).toBe(true);
  });

  it('lists facts with what was written and the families most often wrong', () => {
    expect(gaps.list[0]).toMatchObject({
      text: '7 × 8',
      count: 2,
      written: [54, 54],
      missIds: [1, 2],
    });
    expect(gaps.families[0]).toMatchObject({
      family: 'x7',
      count: 3,
      missIds: [1, 2, 4],
      label: '× and ÷ facts with 7',
    });
    expect(gaps.families[0]!.facts).toEqual(['7 × 8', '56 ÷ 7']);
  });

  it('gives each fact its families', () => {
    expect(factFamiliesOf({ op: 'x', a: 7, b: 8 })).toEqual(['x7', 'x8']);
    expect(factFamiliesOf({ op: '-', a: 15, b: 8 })).toEqual(['+7', '+8']);
    expect(factFamiliesOf({ op: '÷', a: 49, b: 7 })).toEqual(['x7']);
  });
});

describe('patternKeysOf', () => {
  it('names systematic rules, fact families and skills, never fact rules', () => {
    expect(
      patternKeysOf(missOf('2026-03-02', '304 - 75', '139', { skills: ['regrouping'] })),
    ).toEqual(['rule:sub.borrow-across-zero', 'skill:regrouping']);
    expect(patternKeysOf(missOf('2026-03-02', '7 x 8', '54'))).toEqual(['fact:x7', 'fact:x8']);
  });
});

describe('computePatterns', () => {
  it('gives every part at once', () => {
    const p = computePatterns([missOf('2026-03-02', '304 - 75', '139')]);
    expect(Object.keys(p)).toEqual([
      'causeMix',
      'rules',
      'skills',
      'facts',
      'recurring',
      'findings',
      'difficulties',
    ]);
    expect(p.rules[0]!.ruleId).toBe('sub.borrow-across-zero');
    expect(p.recurring).toEqual([]);
  });
});

describe('groupDifficulties', () => {
  // DESIGN.md's catalog: 304 − 75 → 139 and 605 − 48 → 467 skip zeros (sub.borrow-across-zero);
  // 1300 − 522 → 878 and 700 − 24 → 776 change a 0 to 9 only (sub.borrow-from-zero).
  const zeros = 'regrouping across zeros';
  const misses = [
    missOf('2026-03-02', '304 - 75', '139', { id: 1, skills: [zeros] }),
    missOf('2026-03-05', '605 - 48', '467', { id: 2, skills: [zeros] }),
    missOf('2026-03-10', '1300 - 522', '878', { id: 3, skills: [zeros] }),
    missOf('2026-03-17', '700 - 24', '776', { id: 4, skills: [zeros] }),
    missOf('2026-03-18', '58 + 67', '115', { id: 5, skills: ['adding with regrouping'] }),
  ];
  const p = computePatterns(misses, { asOf: '2026-03-31' });

  it('makes one card of a rule, its skill and its family group', () => {
    const zero = p.difficulties.filter((d) => d.ruleIds.some((id) => id.startsWith('sub.')));
    expect(zero).toHaveLength(1);
    expect(zero[0]).toMatchObject({
      key: 'group:zero-regrouping',
      title: 'Regrouping across zeros',
      skills: [zeros],
      count: 4,
    });
    expect(zero[0]!.ruleIds).toEqual(
      expect.arrayContaining(['sub.borrow-across-zero', 'sub.borrow-from-zero']),
    );
    expect(zero[0]!.patternKeys).toContain(`skill:${zeros}`);
    // No separate card for the skill, nor for either rule.
    expect(p.difficulties.map((d) => d.key)).not.toContain(`skill:${zeros}`);
    expect(p.difficulties.map((d) => d.key)).not.toContain('rule:sub.borrow-across-zero');
  });

  it('lists the problems themselves, latest first', () => {
    const zero = p.difficulties[0]!;
    expect(zero.evidence.map((e) => [e.problem, e.answer, e.occurredOn])[0]).toEqual([
      '700 − 24',
      '776',
      '2026-03-17',
    ]);
  });

  it('calls a card a finding only when one of its rules meets the definition', () => {
    for (const d of p.difficulties) {
      const rules = p.findings.rules.filter((r) => d.ruleIds.includes(r.ruleId));
      const meets = rules.some((r) => r.explains >= 2 && r.contradictions.length === 0);
      expect(d.status === 'finding', d.key).toBe(meets);
    }
    expect(p.difficulties[0]!.status).toBe('finding');
    expect(p.difficulties.find((d) => d.key === 'rule:add.no-carry')).toMatchObject({
      status: 'possible',
      title: 'Carry dropped (addition)',
    });
  });
});
