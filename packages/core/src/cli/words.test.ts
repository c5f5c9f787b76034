// Words a parent reads: no digit "becomes −1", and no sentence said twice on one screen
// (the CLI's diagnosis page, which shows the usual answer once at the top).
import { describe, expect, it } from 'vitest';
import { diagnose } from '../diagnose/diagnose.js';
import { evaluationCases } from '../testing/evaluationCases.js';
import { main } from './main.js';

const cases = evaluationCases(7, 25).filter((c) => c.kind !== 'right');
// Problems whose lending digit is 0, where a rule that never reduces it used to say "−1".
const zeros: [string, string][] = [
  ['904 - 37', '977'],
  ['1300 - 522', '888'],
  ['5005 - 2346', '3769'],
];

function screen(problem: string, answer: string): string[] {
  let text = '';
  const status = main(
    ['diagnose', problem, answer],
    { write: (t: string) => (text += t) },
    { write: () => undefined },
  );
  expect(status).toBe(0);
  return text.split('\n');
}

describe('words for a parent', () => {
  it('never says a digit became a number below zero', () => {
    const negative = /(^|[\s(])[-−]\d/;
    for (const [p, a] of [...zeros, ...cases.map((c): [string, string] => [c.problem, c.answer])]) {
      const d = diagnose(p, a);
      if (!d.ok) throw new Error(p);
      const said = [
        ...d.rules.map((r) => r.explanation),
        ...d.notes,
        d.firstWrongStep?.note ?? '',
        d.suggestedCause?.because ?? '',
      ];
      for (const s of said) expect(s, `${p} → ${a}`).not.toMatch(negative);
    }
  }, 60_000);

  it('says the 0 becomes 9 when the lending digit is 0', () => {
    const d = diagnose('904 - 37', '977');
    if (!d.ok) throw new Error('unreadable');
    expect(d.rules[0]?.explanation).toContain('it stayed 0');
    expect(d.rules[0]?.explanation).toContain('the 0 becomes 9');
  });

  it('says no sentence twice on the CLI diagnosis page', () => {
    const many = [
      ['round 2350 to nearest hundred', '2300'],
      ['225 - 0', '220'],
      ...zeros,
      ...cases.map((c) => [c.problem, c.answer]),
    ] as [string, string][];
    for (const [p, a] of many) {
      const sentences = screen(p, a)
        .map((l) => l.trim())
        .filter((l) => /[a-z]{3}/i.test(l) && l.length >= 24 && l.endsWith('.'));
      sentences.forEach((s, i) =>
        expect(
          sentences.slice(0, i).filter((earlier) => earlier.includes(s)),
          `${p} → ${a}: “${s}”`,
        ).toEqual([]),
      );
      // The usual answer is given once, in the header, not again in each explanation.
      expect(
        sentences.filter((s) => /usual working gives/.test(s)),
        `${p} → ${a}`,
      ).toEqual([]);
    }
  }, 60_000);
});
