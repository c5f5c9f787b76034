import { describe, expect, it } from 'vitest';
import { checkLines } from './checkLines.js';
import { lineVerdict } from './lineVerdict.js';

describe('lineVerdict', () => {
  it('names right lines, the first that differs with its value, and lines that follow from it', () => {
    // 60 − 18 = 42 by plain arithmetic, so "58" differs; 58 + 7 = 65 is right given 58.
    const check = checkLines(['4 x 15 = 60', '60 - 18 = 58', '58 + 7 = 65', '65 + 1 = 67']);
    if (!check.ok) throw new Error(check.error.message);
    expect(check.lines.map((l) => lineVerdict(l, check.firstWrongLine))).toEqual([
      'Right',
      'Differs: this comes to 42 · the first line that differs',
      'Right · follows from line 2',
      'Differs: this comes to 66',
    ]);
  });
});
