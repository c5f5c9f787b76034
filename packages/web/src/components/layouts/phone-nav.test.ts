import { describe, expect, it } from 'vitest';

import type { Me } from '../../lib/auth';
import { NAV_ITEMS, phoneNav, visibleNavItems } from './app-shell';

const me = (role: 'owner' | 'parent' | 'tutor'): Me =>
  ({
    user: { id: 1, email: 'a@example.test', displayName: 'A', isAdmin: false },
    household: { id: 10, name: 'Home', role },
    households: [{ id: 10, name: 'Home', role }],
  }) as unknown as Me;

const labels = (role: 'owner' | 'parent' | 'tutor') => {
  const { bar, more } = phoneNav(me(role), visibleNavItems(me(role)));
  return { bar: bar.map((i) => i.label), more: more.map((i) => i.label) };
};

describe('the phone bar', () => {
  it.each(['owner', 'parent'] as const)(
    'puts Patterns and Review plans one tap away for a %s, after Log a miss and the notebook',
    (role) => {
      const { bar, more } = labels(role);
      expect(bar).toEqual(['Log a miss', 'Notebook', 'Patterns', 'Review plans']);
      expect(more).toEqual([
        'Sittings',
        'Students',
        'Answer keys',
        'Curriculum',
        'Members',
        'Account',
      ]);
    },
  );

  it('starts a tutor at Patterns', () => {
    const { bar, more } = labels('tutor');
    expect(bar).toEqual(['Patterns', 'Notebook', 'Review plans', 'Students']);
    expect(more).not.toContain('Log a miss');
    expect(more).toContain('Account');
  });

  it('leaves no page out: every visible page is on the bar or behind More', () => {
    const { bar, more } = labels('owner');
    expect([...bar, ...more].sort()).toEqual(NAV_ITEMS.map((i) => i.label).sort());
  });
});
