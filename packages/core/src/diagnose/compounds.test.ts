import { describe, expect, it } from 'vitest';
import { readFixture } from '../testing/fixtures.js';
import { diagnose } from './diagnose.js';

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
});
