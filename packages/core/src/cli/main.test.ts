import { describe, expect, it } from 'vitest';
import { main } from './main.js';

function run(...argv: string[]): { code: number; out: string; err: string } {
  let out = '';
  let err = '';
  const code = main(
    argv,
    { write: (s: string) => (out += s) },
    { write: (s: string) => (err += s) },
  );
  return { code, out, err };
}

describe('the workback CLI', () => {
  it('diagnose --json names sub.borrow-across-zero with the working trace (issue 3)', () => {
    const { code, out, err } = run('diagnose', '304 - 75', '139', '--json');
    expect(code).toBe(0);
    expect(err).toBe('');
    const d = JSON.parse(out);
    expect(d.rules[0].id).toBe('sub.borrow-across-zero');
    expect(d.trace.expected.kind).toBe('column-subtraction');
    expect(d.trace.child.working.result).toBe('139');
  });

  it('prints a readable diagnosis by default', () => {
    const { code, out } = run('diagnose', '81 - 38', '57');
    expect(code).toBe(0);
    expect(out).toContain('Expected: 43');
    expect(out).toContain('sub.smaller-from-larger');
    expect(out).toContain('Casting out nines');
  });

  it('exits 0 for a right answer too', () => {
    const { code, out } = run('diagnose', '81 - 38', '43');
    expect(code).toBe(0);
    expect(out).toContain('The answer is right.');
  });

  it('takes written steps', () => {
    const { code, out } = run(
      'diagnose',
      '34 x 12',
      '418',
      '--steps',
      '{"partials":["68","340"]}',
      '--json',
    );
    expect(code).toBe(0);
    expect(JSON.parse(out).rules[0].id).toBe('mul.partials-added-wrong');
  });

  it('nines prints both checks', () => {
    const { code, out } = run('nines', '347 + 589', '936', '--json');
    expect(code).toBe(0);
    const j = JSON.parse(out);
    expect(j.nines.passes).toBe(true);
    expect(typeof j.elevens.passes).toBe('boolean');
    expect(run('nines', '321 - 235', '68').out).toContain('The elevens check fails');
  });

  it('practice makes problems for a rule', () => {
    const { code, out } = run(
      'practice',
      'sub.borrow-across-zero',
      '--count',
      '3',
      '--digits',
      '4',
      '--seed',
      '9',
      '--json',
    );
    expect(code).toBe(0);
    expect(JSON.parse(out).problems).toHaveLength(3);
  });

  it.each([
    [['diagnose', '304 $ 75', '1'], /could not read the problem: I could not read “\$”/],
    [['diagnose', '304 - 75', 'x'], /could not read the answer/],
    [['diagnose', '304 - 75'], /needs a problem and an answer/],
    [['diagnose', '34 x 12', '408', '--steps', '{oops'], /not valid JSON/],
    [['nines', '1/2 + ', '1'], /could not read the problem/],
    [['practice', 'no.such-rule'], /not a rule in the catalog/],
    [['practice', 'sub.fact', '--count', 'many'], /--count needs a whole number/],
    [['frobnicate'], /unknown command/],
    [['diagnose', '1 + 1', '2', '--loud'], /unknown option --loud/],
    [[], /no command/],
  ])('exits 2 with one line on stderr for %j', (argv, message) => {
    const { code, out, err } = run(...argv);
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err).toMatch(message);
    expect(err.trim().split('\n')).toHaveLength(1);
  });

  it('--help prints usage and exits 0', () => {
    const { code, out } = run('--help');
    expect(code).toBe(0);
    expect(out).toContain('workback diagnose');
  });
});

describe('workback checkup', () => {
  it('--json lists each problem with the answer of every working (issue 17)', () => {
    const { code, out, err } = run(
      'checkup',
      'sub.borrow-across-zero',
      'sub.borrow-from-zero',
      '--digits',
      '4',
      '--seed',
      '3',
      '--json',
    );
    expect(err).toBe('');
    expect(code).toBe(0);
    const sheet = JSON.parse(out) as {
      problems: { problem: string; answers: Record<string, string> }[];
    };
    expect(sheet.problems.length).toBeGreaterThanOrEqual(4);
    expect(sheet.problems.length).toBeLessThanOrEqual(6);
    for (const p of sheet.problems) {
      expect(Object.keys(p.answers).sort()).toEqual(
        ['correct', 'sub.borrow-across-zero', 'sub.borrow-from-zero'].sort(),
      );
      // Right answers by plain arithmetic (common practice, no source).
      const [top, bottom] = p.problem.split(' − ').map((n) => BigInt(n));
      expect(p.answers.correct).toBe(String((top as bigint) - (bottom as bigint)));
    }
  });

  it('prints a readable sheet with the parent’s answers by default', () => {
    const { code, out } = run('checkup', 'add.no-carry');
    expect(code).toBe(0);
    expect(out).toContain('usual working:');
    expect(out).toContain('add.no-carry:');
  });

  it('exits 2 naming what it could not use', () => {
    expect(run('checkup').code).toBe(2);
    const unknown = run('checkup', 'add.sideways');
    expect(unknown.code).toBe(2);
    expect(unknown.err).toContain('“add.sideways” is not a rule');
    expect(run('checkup', 'add.no-carry', '--digits', 'four').err).toContain(
      '--digits needs a whole number',
    );
  });
});

describe('workback lines', () => {
  it('--json names the first wrong line and the lines that follow from it (issue 16)', () => {
    const { code, out, err } = run('lines', '4 x 15 = 60', '60 - 18 = 52', '52 + 7 = 59', '--json');
    expect(err).toBe('');
    expect(code).toBe(0);
    const checked = JSON.parse(out) as {
      firstWrongLine: number;
      lines: { ok: boolean; expected: string; followsFrom: number | null }[];
    };
    expect(checked.firstWrongLine).toBe(2);
    expect(checked.lines.map((l) => l.ok)).toEqual([true, false, true]);
    expect(checked.lines[1]!.expected).toBe('42');
    expect(checked.lines[2]!.followsFrom).toBe(2);
  });

  it('prints each line with its verdict by default, and exits 2 on a line it cannot read', () => {
    const { code, out } = run('lines', '4 x 15 = 60', '60 - 18 = 52');
    expect(code).toBe(0);
    expect(out).toContain('differs: it comes to 42');
    const bad = run('lines', '60 take away 18');
    expect(bad.code).toBe(2);
    expect(bad.err).toContain('no “=”');
    expect(run('lines').code).toBe(2);
  });
});
