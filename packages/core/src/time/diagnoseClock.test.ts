import { describe, expect, it } from 'vitest';
import { diagnose } from '../diagnose/diagnose.js';
import { parseProblem } from '../parse/parseProblem.js';
import { seededRandom } from '../practice/seededRandom.js';

const ok = (problem: string, answer: string) => {
  const d = diagnose(problem, answer);
  if (!d.ok) throw new Error(`${problem} → ${answer}: ${d.error.message}`);
  return d;
};

describe('clock times', () => {
  it('adds and subtracts hours and minutes, 60 minutes to the hour', () => {
    expect(ok('3:15 - 1:50', '1:25')).toMatchObject({ expected: '1:25', correct: true });
    expect(ok('2:45 + 1:30', '4:15')).toMatchObject({ expected: '4:15', correct: true });
    expect(ok('2:45 + 1:30', '4:15').trace.expected).toMatchObject({ kind: 'clock' });
  });

  it.each([
    ['3:15 - 1:50', '1:65', 'time.hundred-minutes'],
    ['2:45 + 1:30', '3:75', 'time.minutes-not-carried'],
  ])('%s → %s is %s (DESIGN.md)', (problem, answer, rule) => {
    const d = ok(problem, answer);
    expect(d.correct).toBe(false);
    expect(d.rules[0]?.id).toBe(rule);
    expect(d.firstWrongStep?.place).toBe('minutes');
  });

  it('names the hours when only they differ, and asks for h:mm when the answer is not a time', () => {
    expect(ok('3:15 - 1:50', '2:25').firstWrongStep).toMatchObject({ place: 'hours' });
    expect(ok('3:15 - 1:50', '85').notes[0]).toContain('hours and minutes');
  });

  it('refuses times it cannot work', () => {
    expect(parseProblem('3:75 - 1:50').ok).toBe(false);
    expect(parseProblem('1:15 - 3:50').ok).toBe(false);
  });

  it('agrees with minute arithmetic on a clock of Date objects for 2,000 random pairs', () => {
    // Outside check: the JavaScript Date arithmetic of elapsed minutes (UTC, no time zone).
    const random = seededRandom(60);
    for (let i = 0; i < 2000; i += 1) {
      const [h1, m1, h2, m2] = [12, 60, 12, 60].map((n) => Math.floor(random() * n)) as number[];
      const a = Date.UTC(2026, 0, 1, h1, m1);
      const b = Date.UTC(2026, 0, 1, h2, m2);
      const add = i % 2 === 0;
      const [x, y] = !add && a < b ? [b, a] : [a, b];
      const t = (ms: number) =>
        `${new Date(ms).getUTCHours()}:${String(new Date(ms).getUTCMinutes()).padStart(2, '0')}`;
      const total = (add ? x - Date.UTC(2026, 0, 1) + (y - Date.UTC(2026, 0, 1)) : x - y) / 60_000;
      const expected = `${Math.floor(total / 60)}:${String(total % 60).padStart(2, '0')}`;
      const d = ok(`${t(x)} ${add ? '+' : '-'} ${t(y)}`, expected);
      expect(d.correct, `${t(x)} ${add ? '+' : '-'} ${t(y)}`).toBe(true);
    }
  });
});
