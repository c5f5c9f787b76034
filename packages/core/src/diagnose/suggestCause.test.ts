import { describe, expect, it } from 'vitest';
import { diagnose } from './diagnose.js';

const cause = (p: string, a: string): string | null => {
  const d = diagnose(p, a);
  if (!d.ok) throw new Error(d.error.message);
  return d.suggestedCause?.cause ?? null;
};

describe('suggestCause', () => {
  it('suggests a method step when a systematic rule reproduces the answer', () => {
    expect(cause('81 - 38', '57')).toBe('step'); // DESIGN.md catalog example
  });
  it('suggests a basic fact when only a fact slip explains it', () => {
    expect(cause('7 x 8', '54')).toBe('fact');
  });
  it('suggests copying for the right digits shifted a column', () => {
    expect(cause('46 + 23', '690')).toBe('copying'); // computed: 69 written one column left
    expect(cause('46 + 23', '276')).toBe('copying'); // computed: 46 + 230, the 23 copied one column off
  });
  it('suggests nothing for a right answer or an unexplained one', () => {
    expect(cause('81 - 38', '43')).toBeNull();
    expect(cause('63 x 8', '124')).toBeNull();
  });
});
