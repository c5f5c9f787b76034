import { describe, expect, it } from 'vitest';
import { diagnose } from '../diagnose/diagnose.js';
import type { Diagnosis } from '../diagnose/types.js';
import { readFixture } from '../testing/fixtures.js';
import { RULES } from './catalog.js';

interface CatalogExample {
  rule: string;
  problem: string;
  writes: string;
  correct: string;
}
interface PublishedRule {
  rule: string;
  problem: string;
  answer: string;
  correct: string;
  tag: string;
  source: string;
}

// Source: DESIGN.md, "Error rule catalog" — each rule's own example (copied into fixtures/core/catalog-examples.json).
const catalog = readFixture<{ examples: CatalogExample[] }>('catalog-examples.json').examples;
// Source: shared/reference/worked-examples.json (Brown & Burton 1978; Ben-Zeev; a teacher-education
// carrying exercise; IES practice guide NCEE 2010-4039; a rounding question bank) — each row names its source.
const published = readFixture<{ rules: PublishedRule[] }>('worked-examples.json').rules;

const ok = (p: string, a: string): Diagnosis => {
  const d = diagnose(p, a);
  if (!d.ok) throw new Error(`unreadable: ${d.error.message}`);
  return d;
};

describe('the rule catalog', () => {
  it('has every rule id of DESIGN.md, each once', () => {
    const ids = RULES.map((r) => r.id);
    expect(new Set(ids).size).toBe(ids.length);
    const fromDesign = new Set(catalog.map((e) => e.rule));
    for (const id of fromDesign) expect(ids).toContain(id);
    // The four rules DESIGN.md lists without an example (source: DESIGN.md).
    for (const id of ['add.fact', 'sub.fact', 'mul.fact', 'mul.partials-added-wrong'])
      expect(ids).toContain(id);
    expect(ids).toHaveLength(fromDesign.size + 4);
  });

  it.each(catalog)('$rule: $problem → $writes (correct $correct), as DESIGN.md gives it', (ex) => {
    const d = ok(ex.problem, ex.writes);
    expect(d.expected).toBe(ex.correct);
    expect(d.correct).toBe(false);
    expect(d.rules.map((r) => r.id)).toContain(ex.rule);
    const match = d.rules.find((r) => r.id === ex.rule);
    expect(match?.explanation.length).toBeGreaterThan(20);
  });

  it.each(published)('$rule: $problem → $answer (correct $correct) — $source [$tag]', (ex) => {
    const d = ok(ex.problem, ex.answer);
    expect(d.expected).toBe(ex.correct.replace(/,/g, ''));
    expect(d.rules.map((r) => r.id)).toContain(ex.rule);
  });

  it.each(catalog)('$rule lists nothing for the correct answer to $problem', (ex) => {
    const d = ok(ex.problem, ex.correct);
    expect(d.correct).toBe(true);
    expect(d.rules).toEqual([]);
    expect(d.firstWrongStep).toBeNull();
  });
});

describe('explanations', () => {
  it('name the column and the digits, in plain words', () => {
    const d = ok('40 - 13', '33'); // DESIGN.md example for sub.zero-minus-n-is-n
    const rule = d.rules.find((r) => r.id === 'sub.zero-minus-n-is-n');
    expect(rule?.explanation).toContain('In the ones column 0 − 3 was written as 3');
    const b = ok('304 - 75', '139'); // DESIGN.md example for sub.borrow-across-zero
    expect(b.rules[0]?.explanation).toMatch(
      /ones column.*tens digit is 0.*hundreds \(3 became 2\)/,
    );
  });

  it('never use words of blame', () => {
    for (const ex of catalog) {
      const d = ok(ex.problem, ex.writes);
      for (const r of d.rules)
        expect(r.explanation).not.toMatch(/\b(wrong|mistake|careless|failed|bad)\b/i);
    }
  });
});
