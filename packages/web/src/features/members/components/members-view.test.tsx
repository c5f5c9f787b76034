import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, students, tutorMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const list = (items: unknown[]) => json(200, { items, total: items.length });

const members = [
  {
    id: 1,
    userId: 1,
    displayName: 'Sam',
    email: 'sam@example.test',
    role: 'owner',
    studentIds: null,
    joinedAt: '2026-09-01T10:00:00.000Z',
    isYou: true,
  },
  {
    id: 2,
    userId: 5,
    displayName: 'Robin',
    email: 'robin@example.test',
    role: 'tutor',
    studentIds: [2],
    joinedAt: '2026-09-03T10:00:00.000Z',
    isYou: false,
  },
];

const pending = {
  id: 7,
  email: 'kit@example.test',
  role: 'tutor',
  studentIds: [1, 2],
  invitedBy: { id: 1, displayName: 'Sam' },
  status: 'pending',
  expiresAt: '2026-09-20T10:00:00.000Z',
  createdAt: '2026-09-13T10:00:00.000Z',
};

function openMembers(handlers: Parameters<typeof mockApi>[0] = {}) {
  const api = mockApi({
    ...CSRF,
    'GET /auth/me': json(200, ownerMe),
    'GET /students': list(students),
    'GET /members': list(members),
    'GET /invitations': list([pending]),
    ...handlers,
  });
  renderApp('/members');
  return { ...api, user: userEvent.setup() };
}

describe('Members page', () => {
  it('lists members with their role and the children a tutor sees, and open invitations', async () => {
    openMembers();
    const people = await screen.findByRole('list', { name: 'Members' });
    const robin = within(people).getByText('Robin').closest('li')!;
    expect(within(robin as HTMLElement).getByText('Tutor')).toBeInTheDocument();
    expect(within(robin as HTMLElement).getByText(/Sees Ollie/)).toBeInTheDocument();
    expect(within(people).getByText(/Sees every child/)).toBeInTheDocument();
    // Nobody revokes themselves from this page.
    expect(screen.queryByRole('button', { name: 'Remove Sam' })).not.toBeInTheDocument();
    const waiting = await screen.findByRole('list', { name: 'Invitations waiting' });
    expect(within(waiting).getByText('kit@example.test')).toBeInTheDocument();
    expect(within(waiting).getByText('Would see Juniper and Ollie')).toBeInTheDocument();
  });

  it('asks for at least one child before inviting a tutor, then sends the chosen ones', async () => {
    const { user, requests } = openMembers({
      'POST /invitations': json(201, { ...pending, id: 8, email: 'lee@example.test' }),
    });
    await user.click(await screen.findByRole('button', { name: 'Invite someone' }));
    const dialog = await screen.findByRole('dialog');
    await user.type(within(dialog).getByLabelText('Their e-mail'), 'lee@example.test');
    await user.click(within(dialog).getByRole('button', { name: 'Send invitation' }));
    expect(
      await within(dialog).findByText('Tick at least one child the tutor may see.'),
    ).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST' && r.path === '/invitations')).toBe(false);

    await user.click(within(dialog).getByLabelText('Ollie'));
    await user.click(within(dialog).getByRole('button', { name: 'Send invitation' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    const sent = requests.find((r) => r.method === 'POST' && r.path === '/invitations');
    expect(sent?.body).toEqual({ email: 'lee@example.test', role: 'tutor', studentIds: [2] });
    expect(sent?.headers['x-csrf-token']).toBe('csrf-1');
    expect(await screen.findByText(/Invitation sent to lee@example.test/)).toBeInTheDocument();
  });

  it('shows the API’s conflict under the e-mail field', async () => {
    const { user } = openMembers({
      'POST /invitations': json(409, {
        statusCode: 409,
        error: 'Conflict',
        message: 'That person is already a member of this household',
        fields: { email: 'is already a member of this household' },
      }),
    });
    await user.click(await screen.findByRole('button', { name: 'Invite someone' }));
    const dialog = await screen.findByRole('dialog');
    await user.type(within(dialog).getByLabelText('Their e-mail'), 'robin@example.test');
    await user.selectOptions(within(dialog).getByLabelText('They join as'), 'parent');
    expect(within(dialog).queryByText('Children they may see')).not.toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Send invitation' }));
    expect(await within(dialog).findByLabelText('Their e-mail')).toHaveAccessibleDescription(
      'That person is already a member of this household',
    );
  });

  it('changes which children a tutor sees', async () => {
    const { user, requests } = openMembers({
      'PATCH /members/2': json(200, { ...members[1], studentIds: [1, 2] }),
    });
    await user.click(await screen.findByRole('button', { name: 'Change access for Robin' }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByLabelText('Ollie')).toBeChecked();
    await user.click(within(dialog).getByLabelText('Juniper'));
    await user.click(within(dialog).getByRole('button', { name: 'Save access' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    const patch = requests.find((r) => r.method === 'PATCH');
    expect(patch?.body).toEqual({ studentIds: [1, 2] });
  });

  it('asks before revoking, and keeps a refusal on screen in plain words', async () => {
    const { user, requests } = openMembers({
      'DELETE /members/2': json(403, {
        statusCode: 403,
        error: 'Forbidden',
        message: 'A parent may not change or remove the owner',
      }),
    });
    await user.click(await screen.findByRole('button', { name: 'Remove Robin' }));
    const alert = await screen.findByRole('alertdialog');
    expect(within(alert).getByText(/From their next click they see nothing/)).toBeInTheDocument();
    await user.click(within(alert).getByRole('button', { name: 'Remove access' }));
    expect(
      await within(alert).findByText('A parent may not change or remove the owner'),
    ).toBeInTheDocument();
    expect(requests.filter((r) => r.method === 'DELETE')).toHaveLength(1);
  });

  it('withdraws a pending invitation', async () => {
    const { user, requests } = openMembers({ 'DELETE /invitations/7': json(204) });
    await user.click(
      await screen.findByRole('button', { name: 'Withdraw the invitation to kit@example.test' }),
    );
    expect(await screen.findByText(/Its link no longer works/)).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'DELETE' && r.path === '/invitations/7')).toBe(true);
  });

  it('tells a tutor that the family manages members, without asking the API', async () => {
    const { requests } = mockApi({ 'GET /auth/me': json(200, tutorMe) });
    renderApp('/members');
    expect(await screen.findByText('Owners and parents manage members')).toBeInTheDocument();
    expect(requests.some((r) => r.path === '/members')).toBe(false);
  });
});
