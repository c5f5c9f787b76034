import { describe, expect, it } from 'vitest';
import { readFixture } from '../testing/fixtures.js';
import { diagnose } from './diagnose.js';
import { wrongFacts, wrongProducts } from './wrongFacts.js';

interface Compound {
  rules: string[];
  problem: string;
  answer: string;
  correct: string;
  slip: { a: number; b: number; written: number };
  tag: string;
  source: string;
}

// Source: fixtures/core/worked-examples.json "compounds" — a published rule's working (Brown &
// Burton 1978; Ben-Zeev; a teacher-education carrying exercise; Ashlock [M]) with one basic
// fact slipped, computed by hand (tag C); the slip list is common practice, no source.
const compounds = readFixture<{ compounds: Compound[] }>('worked-examples.json').compounds;

describe('a rule together with one fact slip', () => {
  it.each(compounds)('$problem → $answer (correct $correct): $rules — $source [$tag]', (ex) => {
    const d = diagnose(ex.problem, ex.answer);
    if (!d.ok) throw new Error(d.error.message);
    expect(d.expected).toBe(ex.correct.replace(/,/g, ''));
    expect(d.correct).toBe(false);
    expect(d.rules[0]?.ids).toEqual(ex.rules);
    expect(d.facts).toMatchObject([ex.slip]);
    expect(d.suggestedCause?.cause).toBe('step');
    expect(d.suggestedCause?.ruleIds).toEqual([ex.rules[0]]);
  });

  it('names the slip and its column in words', () => {
    const d = diagnose('923 - 35', '999');
    if (!d.ok) throw new Error('unreadable');
    expect(d.rules[0]?.explanation).toContain('13 − 5 was taken as 9 instead of 8');
    const m = diagnose('705 x 7', '7215');
    if (!m.ok) throw new Error('unreadable');
    expect(m.rules[0]?.explanation).toContain('the 7 with the carried 2 added first');
  });

  // The list of plausible wrong facts and the ranking by slip size: common practice, no source.
  it('uses one list of wrong products: short by exactly the carry added after is a carry not added', () => {
    expect(wrongFacts('x', 7, 8)).toEqual([55, 57, 54, 58, 63, 49, 64, 48]);
    expect(wrongProducts(7, 8, 2)).toEqual([55, 57, 58, 63, 49, 64, 48]);
    expect(wrongProducts(7, 8, 0)).toEqual(wrongFacts('x', 7, 8));
  });

  it('ranks the rule with the smaller slip first', () => {
    // writes-carry with 0 + 2 taken as 1 (one off) before carry-reversed with 8 + 8 taken as 18 (two off).
    const d = diagnose('408 + 5628', '5111');
    if (!d.ok) throw new Error('unreadable');
    expect(d.rules.map((r) => r.id)).toEqual([
      'add.writes-carry+add.fact',
      'add.carry-reversed+add.fact',
    ]);
    expect(d.facts).toMatchObject([{ a: 0, b: 2, written: 1 }]);
  });

  it('takes a slip as far off either way as equally small, then keeps catalog order', () => {
    // 13 − 6 taken as 5 (two less, borrow-no-decrement) and 6 − 3 taken as 5 (two more,
    // smaller-from-larger) write 4573 alike: one answer cannot tell them apart.
    const d = diagnose('4397 - 624', '4573');
    if (!d.ok) throw new Error('unreadable');
    expect(d.rules.map((r) => r.id)).toEqual([
      'sub.smaller-from-larger+sub.fact',
      'sub.borrow-no-decrement+sub.fact',
    ]);
  });
});
