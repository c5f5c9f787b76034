import { describe, expect, it } from 'vitest';

import { ruleTitle, shownRule } from './types';

describe('the notebook’s rule column', () => {
  it('names the rule the list is filtered by, alone or inside a pair', () => {
    const ids = ['sub.smaller-from-larger', 'sub.borrow-no-decrement+sub.zero-minus-n-is-n'];
    expect(shownRule(ids, null)).toBe('sub.smaller-from-larger');
    expect(shownRule(ids, 'sub.zero-minus-n-is-n')).toBe(
      'sub.borrow-no-decrement+sub.zero-minus-n-is-n',
    );
    expect(shownRule(ids, 'add.no-carry')).toBe('sub.smaller-from-larger');
    expect(shownRule([], 'add.no-carry')).toBeUndefined();
    // A family of rules (a Patterns card's link) names the family's rule the miss has.
    expect(shownRule(ids, 'group:zero-regrouping')).toBe(
      'sub.borrow-no-decrement+sub.zero-minus-n-is-n',
    );
  });

  it('gives each rule a unique name, adding the operation where titles repeat', () => {
    expect(ruleTitle('add.no-carry')).toBe('Carry dropped (addition)');
    expect(ruleTitle('mul.no-carry')).toBe('Carry dropped (multiplication)');
    expect(ruleTitle('sub.borrow-no-decrement+sub.fact')).toContain(' + ');
  });
});
