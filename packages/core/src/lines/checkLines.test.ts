import { describe, expect, it } from 'vitest';
import { checkLines } from './checkLines.js';

describe('checkLines', () => {
  it('checks each sentence and names the first wrong line', () => {
    // A two-step word problem worked in three sentences (invented; the arithmetic is
    // common practice, no source).
    const result = checkLines(['4 x 15 = 60', '60 - 18 = 52', '52 + 7 = 59']);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.firstWrongLine).toBe(2);
    expect(result.lines.map((l) => l.ok)).toEqual([true, false, true]);
    expect(result.lines[1]!.expected).toBe('42');
    expect(result.lines[1]!.written).toBe('52');
  });

  it('marks a later line that goes on with a wrong result as following from it', () => {
    const result = checkLines(['4 x 15 = 60', '60 - 18 = 52', '52 + 7 = 59']);
    if (!result.ok) throw new Error(result.error.message);
    expect(result.lines[2]!.followsFrom).toBe(2);
    expect(result.lines[0]!.followsFrom).toBeNull();
    expect(result.lines[1]!.followsFrom).toBeNull();
  });

  it('gives each wrong line its own diagnosis', () => {
    const result = checkLines(['304 - 75 = 139', '139 + 20 = 159']);
    if (!result.ok) throw new Error(result.error.message);
    expect(result.lines[0]!.diagnosis.rules[0]!.id).toBe('sub.borrow-across-zero');
    expect(result.lines[1]!.ok).toBe(true);
    expect(result.lines[1]!.followsFrom).toBe(1);
  });

  it('says all is right when every line is', () => {
    const result = checkLines(['4 x 15 = 60', '60 - 18 = 42', '42 + 7 = 49']);
    expect(result).toMatchObject({ ok: true, firstWrongLine: null });
  });

  it('sets units aside for perimeter and measurement sentences', () => {
    // Perimeter of a 15 cm by 8 cm rectangle: 2 × (15 + 8) (common practice, no source).
    const result = checkLines(['15 cm + 8 cm = 23 cm', '2 x 23 cm = 46 cm']);
    expect(result).toMatchObject({ ok: true, firstWrongLine: null });
  });

  it('reads commas, the minus sign and blank lines as a child writes them', () => {
    const result = checkLines(['', '1,200 − 350 = 850', '  ', '850 ÷ 5 = 170']);
    expect(result).toMatchObject({ ok: true, firstWrongLine: null });
    if (result.ok) expect(result.lines.map((l) => l.line)).toEqual([1, 2]);
  });

  it('names the line it cannot read, and why', () => {
    expect(checkLines(['4 x 15 = 60', '60 take away 18'])).toMatchObject({
      ok: false,
      line: 2,
    });
    const noEquals = checkLines(['60 - 18']);
    expect(noEquals).toMatchObject({ ok: false, line: 1 });
    if (!noEquals.ok) expect(noEquals.error.message).toContain('no “=”');
    const two = checkLines(['2 + 2 = 4 = 4']);
    expect(two.ok).toBe(false);
    if (!two.ok) expect(two.error.message).toContain('more than one');
    expect(checkLines([]).ok).toBe(false);
    expect(checkLines(Array.from({ length: 21 }, () => '1 + 1 = 2')).ok).toBe(false);
  });
});
