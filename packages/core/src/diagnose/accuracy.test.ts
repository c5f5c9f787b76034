// How often the engine names the cause first (top-1), measured on a seeded table of answers
// made the way a child makes them (src/testing/evaluationCases.ts): one systematic rule, one
// basic-fact slip, a rule together with a slip, two adjacent digits swapped, the right answer.
// Compound errors and one-off slips beside systematic ones: Burton 1982 and VanLehn 1990
// (shared/reference/README.md, [P2/M]); the list of plausible wrong facts is common
// practice, no source.
import { beforeAll, describe, expect, it } from 'vitest';
import { ruleInfo } from '../rules/catalog.js';
import { evaluationCases, type EvaluationCase } from '../testing/evaluationCases.js';
import { diagnose } from './diagnose.js';
import type { Diagnosis } from './types.js';

const isSystematic = (id: string): boolean => ruleInfo(id)?.kind === 'systematic';

interface Scored {
  readonly c: EvaluationCase;
  readonly d: Diagnosis;
  /** The first explanation is the one that made the answer. */
  readonly strict: boolean;
  /** …or, where a simpler explanation gives the very same answer, a simpler one is first. */
  readonly fair: boolean;
}

function score(c: EvaluationCase): Scored {
  const d = diagnose(c.problem, c.answer);
  if (!d.ok) throw new Error(`${c.problem} → ${c.answer}: ${d.error.message}`);
  const top = d.rules[0];
  let strict: boolean;
  let fair: boolean;
  switch (c.kind) {
    case 'right':
      strict = fair = d.correct && d.rules.length === 0;
      break;
    case 'swap':
      // Careless: no systematic rule is claimed for it, unless a rule writes this very answer.
      strict = !d.rules.some((r) => r.ids.some(isSystematic));
      fair = strict || c.simplerAnswers.has(c.answer);
      break;
    case 'rule':
      strict = top?.id === c.ids[0];
      fair = strict || (top !== undefined && c.ties.includes(top.id));
      break;
    default: {
      strict = top?.id === c.ids.join('+');
      const tie = top !== undefined && c.ties.includes(top.id);
      // A simpler explanation (a single rule, or a single slip for a compound) ranks higher by design.
      const simplerFirst =
        c.simplerAnswers.has(c.answer) && (top?.score ?? 0) > (c.kind === 'fact' ? 0.75 : 0.4);
      fair = strict || tie || simplerFirst;
    }
  }
  return { c, d, strict, fair };
}

const pct = (n: number, of: number): string => `${((100 * n) / Math.max(1, of)).toFixed(1)}%`;

describe('top-1 on a seeded table of children’s answers', () => {
  let scored: Scored[] = [];
  beforeAll(() => {
    scored = evaluationCases(2026, 150).map(score);
    const rows: string[] = [];
    for (const kind of ['rule', 'fact', 'compound', 'swap', 'right'] as const) {
      const set = scored.filter((s) => s.c.kind === kind);
      rows.push(
        `${kind.padEnd(9)} ${String(set.length).padStart(5)}  top-1 ${pct(set.filter((s) => s.strict).length, set.length).padStart(6)}  (ambiguous-aware ${pct(set.filter((s) => s.fair).length, set.length)})`,
      );
    }
    const verdicts = scored.filter((s) => s.d.correct === (s.c.kind === 'right')).length;
    rows.push(
      `overall   ${String(scored.length).padStart(5)}  top-1 ${pct(scored.filter((s) => s.strict).length, scored.length).padStart(6)}  (ambiguous-aware ${pct(scored.filter((s) => s.fair).length, scored.length)}); right/wrong verdicts ${pct(verdicts, scored.length)}`,
    );
    console.log(`Diagnosis accuracy (seed 2026):\n${rows.join('\n')}`);
  }, 120_000);

  it('keeps every right/wrong verdict', () => {
    for (const s of scored)
      expect(s.d.correct, `${s.c.problem} → ${s.c.answer}`).toBe(s.c.kind === 'right');
  });

  // The targets count a tie one answer cannot break (another rule writing the very same
  // answer on this problem, or an explanation DESIGN.md ranks higher giving it) as named;
  // the strict figures, printed above, are held too so that they cannot slide.
  it('names a systematic rule plus one slip first in at least 90% of compounds', () => {
    const set = scored.filter((s) => s.c.kind === 'compound');
    expect(set.length).toBeGreaterThan(300);
    expect(set.filter((s) => s.fair).length / set.length).toBeGreaterThanOrEqual(0.9);
    expect(set.filter((s) => s.strict).length / set.length).toBeGreaterThanOrEqual(0.85);
  });

  it('names the cause first in at least 97% of all cases', () => {
    expect(scored.filter((s) => s.fair).length / scored.length).toBeGreaterThanOrEqual(0.97);
    expect(scored.filter((s) => s.strict).length / scored.length).toBeGreaterThanOrEqual(0.95);
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

  it('ranks round.half-down first when the dropped digits are exactly 5 (then zeros)', () => {
    const set = scored.filter((s) => s.c.ids[0] === 'round.half-down');
    expect(set.length).toBeGreaterThan(5);
    for (const s of set) expect(s.d.rules[0]?.id, s.c.problem).toBe('round.half-down');
  });
});
