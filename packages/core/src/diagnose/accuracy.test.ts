// How often the engine names the cause first (top-1), measured on a seeded table of answers
// made the way a child makes them (src/testing/evaluationCases.ts): one systematic rule, one
// basic-fact slip, a rule together with a slip, two adjacent digits swapped, the right answer.
// Compound errors and one-off slips beside systematic ones: Burton 1982 and VanLehn 1990
// (shared/reference/README.md, [P2/M]); the list of plausible wrong facts is common
// practice, no source; so is ranking the explanation that needs fewer or smaller slips first.
//
// Why some cases are set aside (the "ambiguous" count): when another explanation exactly as
// simple writes the very same answer (two rules that write the same digits on this problem,
// two rules each with one slip as far off, or a swap that a single rule writes), the answer
// holds nothing that says which one made it, and the generator's own methods, rerun on the
// problem, cannot tell either. The engine lists both and keeps catalog order; scoring that
// order against a coin-flip choice of the generator would measure the coin. A case where a
// simpler explanation (one slip, one rule, two rules) writes the answer is NOT set aside: it
// stays in and counts as not named.
import { beforeAll, describe, expect, it } from 'vitest';
import { ruleInfo } from '../rules/catalog.js';
import { evaluationCases, type EvaluationCase } from '../testing/evaluationCases.js';
import { misleadingWords } from '../testing/wordsOnScreen.js';
import { diagnose } from './diagnose.js';
import type { Diagnosis } from './types.js';

const isSystematic = (id: string): boolean => ruleInfo(id)?.kind === 'systematic';

interface Scored {
  readonly c: EvaluationCase;
  readonly d: Diagnosis;
  /** The first explanation is the one that made the answer. */
  readonly strict: boolean;
  /**
   * Another explanation exactly as simple writes this very answer, so one answer cannot say
   * which made it (the generator's own methods cannot either): two single rules writing the
   * same answer; two rules each with one slip of the same size; a swap that a single rule
   * writes — and nothing simpler does. Such cases are set aside from the strict figures (and
   * counted, below).
   */
  readonly ambiguous: boolean;
  /** …or, where a simpler explanation gives the very same answer, a simpler one is first. */
  readonly fair: boolean;
}

function score(c: EvaluationCase): Scored {
  const d = diagnose(c.problem, c.answer);
  if (!d.ok) throw new Error(`${c.problem} → ${c.answer}: ${d.error.message}`);
  const top = d.rules[0];
  let strict: boolean;
  let fair: boolean;
  let ambiguous = false;
  switch (c.kind) {
    case 'right':
      strict = fair = d.correct && d.rules.length === 0;
      break;
    case 'swap':
      // Careless: no systematic rule is claimed for it, unless a rule writes this very answer.
      strict = !d.rules.some((r) => r.ids.some(isSystematic));
      ambiguous = c.simplerAnswers.has(c.answer);
      fair = strict || ambiguous;
      break;
    case 'rule':
      strict = top?.id === c.ids[0];
      ambiguous = c.ties.length > 0;
      fair = strict || (top !== undefined && c.ties.includes(top.id));
      break;
    default: {
      strict = top?.id === c.ids.join('+');
      // Where a simpler explanation writes the answer too, the case stays in (not named).
      ambiguous = c.ties.length > 0 && !c.simplerAnswers.has(c.answer);
      const tie = top !== undefined && c.ties.includes(top.id);
      // A simpler explanation (a single rule, or a single slip for a compound) ranks higher by
      // design; the strict figure still counts such a case as not named.
      const simplerFirst =
        c.simplerAnswers.has(c.answer) && (top?.score ?? 0) > (c.kind === 'fact' ? 0.75 : 0.4);
      fair = strict || tie || simplerFirst;
    }
  }
  return { c, d, strict, ambiguous, fair };
}

/** Strict top-1 over the cases one answer can decide (ambiguous ones set aside). */
const strictRate = (set: readonly Scored[]): number => {
  const decided = set.filter((s) => !s.ambiguous);
  return decided.filter((s) => s.strict).length / Math.max(1, decided.length);
};

const pct = (n: number, of: number): string => `${((100 * n) / Math.max(1, of)).toFixed(1)}%`;

describe('top-1 on a seeded table of children’s answers', () => {
  let scored: Scored[] = [];
  beforeAll(() => {
    scored = evaluationCases(2026, 150).map(score);
    const rows: string[] = [];
    const row = (name: string, set: readonly Scored[]): string => {
      const amb = set.filter((s) => s.ambiguous).length;
      return `${name.padEnd(9)} ${String(set.length).padStart(5)}  strict top-1 ${pct(strictRate(set), 1).padStart(6)} (${String(amb).padStart(3)} ambiguous set aside; ${pct(set.filter((s) => s.strict).length, set.length)} counting them)  tie-aware ${pct(set.filter((s) => s.fair).length, set.length)}`;
    };
    for (const kind of ['rule', 'fact', 'compound', 'swap', 'right'] as const)
      rows.push(
        row(
          kind,
          scored.filter((s) => s.c.kind === kind),
        ),
      );
    const verdicts = scored.filter((s) => s.d.correct === (s.c.kind === 'right')).length;
    rows.push(`${row('overall', scored)}; right/wrong verdicts ${pct(verdicts, scored.length)}`);
    console.log(`Diagnosis accuracy (seed 2026):\n${rows.join('\n')}`);
  }, 120_000);

  it('keeps every right/wrong verdict', () => {
    for (const s of scored)
      expect(s.d.correct, `${s.c.problem} → ${s.c.answer}`).toBe(s.c.kind === 'right');
  });

  // The targets are held on the strict figures: the first explanation is exactly the one
  // that made the answer. Only cases that another explanation exactly as simple writes
  // identically are set aside (see `ambiguous`); a case where a simpler explanation (one
  // slip, one rule, two rules) writes the answer stays in and counts as not named. The share
  // set aside is held small too, so that the figures cannot rise by setting more aside.
  it('names a systematic rule plus one slip first in at least 90% of compounds', () => {
    const set = scored.filter((s) => s.c.kind === 'compound');
    expect(set.length).toBeGreaterThan(300);
    expect(strictRate(set)).toBeGreaterThanOrEqual(0.9);
    expect(set.filter((s) => s.ambiguous).length / set.length).toBeLessThanOrEqual(0.12);
  });

  it('names the cause first in at least 97% of all cases', () => {
    expect(strictRate(scored)).toBeGreaterThanOrEqual(0.97);
    expect(scored.filter((s) => s.ambiguous).length / scored.length).toBeLessThanOrEqual(0.05);
  });

  it('still offers the explanation that made an ambiguous answer, beside its equal', () => {
    const set = scored.filter((s) => s.ambiguous && s.c.kind !== 'swap');
    expect(set.length).toBeGreaterThan(0);
    for (const s of set)
      expect(
        s.d.rules.map((r) => r.id),
        `${s.c.problem} → ${s.c.answer}`,
      ).toContain(s.c.ids.join('+'));
  });

  it('claims no rule for a careless digit swap that no rule writes', () => {
    for (const s of scored.filter(
      (x) => x.c.kind === 'swap' && !x.c.simplerAnswers.has(x.c.answer),
    ))
      expect(
        s.d.rules.filter((r) => r.ids.some(isSystematic)).map((r) => r.id),
        `${s.c.problem} → ${s.c.answer}`,
      ).toEqual([]);
  });

  // Issue 11 §4, over the whole table (its diagnoses are made once, above): no digit below
  // zero, no sentence twice on one screen, and no basic fact said both as right and as
  // slipped (a rule plus a slip in its own column tells the slipped value, never the right
  // one as if the child used it), nor a wrong fact stated as right.
  it('tells every answer in words that hold together', () => {
    for (const s of scored)
      expect(misleadingWords(s.d), `${s.c.problem} → ${s.c.answer}`).toEqual([]);
  });

  it('ranks round.half-down first when the dropped digits are exactly 5 (then zeros)', () => {
    const set = scored.filter((s) => s.c.ids[0] === 'round.half-down');
    expect(set.length).toBeGreaterThan(5);
    for (const s of set) expect(s.d.rules[0]?.id, s.c.problem).toBe('round.half-down');
  });
});
