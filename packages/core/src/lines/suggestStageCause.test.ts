import { describe, expect, it } from 'vitest';
import { diagnose } from '../diagnose/diagnose.js';
import { suggestStageCause } from './suggestStageCause.js';

// The stage → cause mapping follows Newman's stages (Newman 1977; White 2005 for the interview
// in practice): the first prompt the child cannot do names where it went wrong.
describe('suggestStageCause', () => {
  it.each([
    ['reading', 'reading'],
    ['comprehension', 'concept'],
    ['transformation', 'concept'],
    ['encoding', 'copying'],
  ] as const)('%s → %s, whatever the working says', (stage, cause) => {
    const working = diagnose('81 - 38', '57');
    if (!working.ok) throw new Error('unreadable');
    expect(suggestStageCause(stage, working.suggestedCause)?.cause).toBe(cause);
    expect(suggestStageCause(stage, null)?.cause).toBe(cause);
  });

  it('process → the working’s own suggestion, rules kept; nothing when it suggests nothing', () => {
    // 81 − 38 → 57 is DESIGN's example of sub.smaller-from-larger.
    const working = diagnose('81 - 38', '57');
    if (!working.ok) throw new Error('unreadable');
    const got = suggestStageCause('process', working.suggestedCause);
    expect(got).toMatchObject({ cause: 'step', ruleIds: ['sub.smaller-from-larger'] });
    expect(got?.because).toMatch(/working it/);
    expect(suggestStageCause('process', null)).toBeNull();
  });
});
