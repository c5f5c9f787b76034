import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, students } from '../../testing/mock-api';
import { renderApp } from '../../testing/render';

const list = (items: unknown[]) => json(200, { items, total: items.length });
const tutorOfTwo = {
  user: { id: 3, email: 'tutor@example.test', displayName: 'Robin', isAdmin: false },
  household: { id: 10, name: 'Maple Table', role: 'tutor' },
  households: [
    { id: 10, name: 'Maple Table', role: 'tutor' },
    { id: 12, name: 'Cedar Porch', role: 'tutor' },
  ],
};

describe('household switcher', () => {
  it('is not there for someone in one household', async () => {
    mockApi({ 'GET /auth/me': json(200, ownerMe), 'GET /students': list(students) });
    renderApp('/students');
    await screen.findByText('Juniper');
    expect(screen.queryByRole('combobox', { name: 'Household' })).not.toBeInTheDocument();
  });

  it('switches a tutor to another family and shows that family’s children', async () => {
    let current = 10;
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': () =>
        json(200, {
          ...tutorOfTwo,
          household: tutorOfTwo.households.find((h) => h.id === current),
        }),
      'GET /students': () => list(current === 10 ? [students[0]] : [students[1]]),
      'POST /households/current': (request) => {
        current = (request.body as { householdId: number }).householdId;
        return json(200, { id: 12, name: 'Cedar Porch', role: 'tutor', createdAt: '2026-01-01' });
      },
    });
    const user = userEvent.setup();
    renderApp('/students');
    await screen.findAllByText('Juniper');
    const sidebar = screen.getByRole('complementary', { name: 'Workback' });
    const select = within(sidebar).getByRole('combobox', { name: 'Household' });
    expect(select).toHaveValue('10');
    await user.selectOptions(select, '12');
    await waitFor(() => expect(screen.queryByText('Juniper')).not.toBeInTheDocument());
    expect((await screen.findAllByText('Ollie')).length).toBeGreaterThan(0);
    expect(within(sidebar).getByRole('combobox', { name: 'Household' })).toHaveValue('12');
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ householdId: 12 });
  });
});
