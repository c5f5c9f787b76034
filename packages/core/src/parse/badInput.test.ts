// Issue 11 §3: no crash on any input, and messages a parent can read — a word named whole,
// an emoji quoted whole, long input shortened, places that are not places refused.
import { describe, expect, it } from 'vitest';
import { main } from '../cli/main.js';
import { diagnose } from '../diagnose/diagnose.js';
import { parseProblem } from './parseProblem.js';

const refusal = (text: string): string => {
  const parsed = parseProblem(text);
  expect(parsed.ok).toBe(false);
  return parsed.ok ? '' : parsed.error.message;
};

describe('problems that are refused with a message', () => {
  it.each(['__proto__', 'constructor', 'toString', 'hasOwnProperty'])(
    'round 3456 to nearest %s is not a place (and diagnose does not throw)',
    (place) => {
      expect(refusal(`round 3456 to nearest ${place}`)).toContain(`“${place}” is not a place`);
      const d = diagnose(`round 3456 to nearest ${place}`, '3500');
      expect(d.ok).toBe(false);
      let err = '';
      const status = main(
        ['diagnose', `round 3456 to nearest ${place}`, '3500'],
        { write: () => undefined },
        { write: (t: string) => (err += t) },
      );
      expect(status).toBe(2);
      expect(err).toContain('not a place');
    },
  );

  it('names a whole word, hyphens and all', () => {
    expect(refusal('forty-three + 7')).toContain('the word “forty-three”');
    expect(refusal('81 minus 38')).toContain('the word “minus”');
  });

  it('quotes an emoji whole, never half of it', () => {
    expect(refusal('81 👍🏽 38')).toContain('“👍🏽”');
    expect(refusal('81 👨‍👩‍👧 38')).toContain('“👨‍👩‍👧”');
  });

  it('shortens very long input in the message', () => {
    const message = refusal(`${'7'.repeat(5000)} + 1`);
    expect(message.length).toBeLessThan(120);
    expect(message).toContain('…”');
    expect(refusal(`round 3456 to nearest ${'x'.repeat(5000)}`).length).toBeLessThan(200);
  });

  it('shortens a long written step in the message', () => {
    const d = diagnose('34 x 12', '408', { steps: { partials: ['6'.repeat(3000) + 'x', '340'] } });
    expect(d.ok).toBe(false);
    if (!d.ok) expect(d.error.message.length).toBeLessThan(160);
  });
});
