import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, students } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const TOKEN = 'tok_abc123';
const signedOut = json(401, { statusCode: 401, error: 'Unauthorized', message: 'Sign in first' });
const preview = {
  email: 'kit@example.test',
  role: 'tutor',
  householdName: 'Maple Table',
  invitedByName: 'Sam',
  expiresAt: '2026-09-20T10:00:00.000Z',
};
const joinedMe = {
  user: { id: 9, email: 'kit@example.test', displayName: 'Kit', isAdmin: false },
  household: { id: 10, name: 'Maple Table', role: 'tutor' },
  households: [{ id: 10, name: 'Maple Table', role: 'tutor' }],
};
const list = (items: unknown[]) => json(200, { items, total: items.length });

describe('invitation page', () => {
  it('says who invited whom to which household, and makes a new account that joins', async () => {
    let signedIn = false;
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': () => (signedIn ? json(200, joinedMe) : signedOut),
      [`GET /invitations/${TOKEN}`]: json(200, preview),
      [`POST /invitations/${TOKEN}/accept`]: () => {
        signedIn = true;
        return json(200, joinedMe);
      },
      'GET /students': list([students[1]]),
    });
    const user = userEvent.setup();
    renderApp(`/invitations/${TOKEN}`);
    expect((await screen.findByText('kit@example.test')).closest('p')).toHaveTextContent(
      'Sam invited kit@example.test to join Maple Table as a tutor.',
    );
    // A tutor is spoken to as a tutor: the children are the family's, not theirs.
    expect(screen.getByText('About the children’s data you will see')).toBeInTheDocument();
    expect(screen.queryByText(/your child|As the owner you can export/i)).not.toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Sign in, then join' })).toHaveAttribute(
      'href',
      `/sign-in?redirectTo=${encodeURIComponent(`/invitations/${TOKEN}`)}`,
    );

    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    expect(await screen.findByText('Tell us what to call you.')).toBeInTheDocument();
    expect(screen.getByText(/accounts are for adults only/)).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);

    await user.type(screen.getByLabelText('Your name'), 'Kit');
    await user.type(screen.getByLabelText('Password'), 'long enough words');
    await user.click(screen.getByText(/I am an adult/));
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    expect(await screen.findByRole('heading', { name: 'Students' })).toBeInTheDocument();
    const accept = requests.find((r) => r.path === `/invitations/${TOKEN}/accept`);
    // The invited address is the default: it is not sent again.
    expect(accept?.body).toEqual({ displayName: 'Kit', password: 'long enough words' });
    expect(await screen.findByText('Welcome to Maple Table.')).toBeInTheDocument();
  });

  it('asks for a sign-in when the e-mail cannot make a new account, without saying why', async () => {
    mockApi({
      ...CSRF,
      'GET /auth/me': signedOut,
      [`GET /invitations/${TOKEN}`]: json(200, preview),
      [`POST /invitations/${TOKEN}/accept`]: json(401, {
        statusCode: 401,
        error: 'Unauthorized',
        message: 'To join with this e-mail, sign in first, then open this link again',
        fields: { email: 'sign in first', password: 'sign in first' },
      }),
    });
    const user = userEvent.setup();
    renderApp(`/invitations/${TOKEN}`);
    await user.type(await screen.findByLabelText('Your name'), 'Kit');
    await user.type(screen.getByLabelText('Password'), 'long enough words');
    await user.click(screen.getByText(/I am an adult/));
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    expect(
      await screen.findByText(
        'To join with this e-mail, sign in first (below), then join; or use another.',
      ),
    ).toBeInTheDocument();
    expect(screen.queryByText(/already/)).toBeNull();
    expect(screen.getByRole('link', { name: 'Sign in, then join' })).toBeInTheDocument();
  });

  it('lets someone signed in join with one click, then fetches a fresh CSRF token', async () => {
    let csrfCalls = 0;
    const { requests } = mockApi({
      'GET /auth/csrf': () => json(200, { token: `csrf-${++csrfCalls}` }),
      'GET /auth/me': json(200, ownerMe),
      [`GET /invitations/${TOKEN}`]: json(200, { ...preview, email: 'sam@example.test' }),
      [`POST /invitations/${TOKEN}/accept`]: json(200, {
        ...ownerMe,
        household: { id: 11, name: 'Maple Table', role: 'parent' },
      }),
      'GET /students': list(students),
      'POST /students': json(201, students[0]),
    });
    const user = userEvent.setup();
    renderApp(`/invitations/${TOKEN}`);
    expect(await screen.findByText(/You are signed in as/)).toHaveTextContent('Sam');
    await user.click(screen.getByRole('button', { name: 'Join Maple Table' }));
    await screen.findByRole('heading', { name: 'Students' });
    const accept = requests.find((r) => r.path === `/invitations/${TOKEN}/accept`);
    expect(accept?.body).toEqual({});
    expect(accept?.headers['x-csrf-token']).toBe('csrf-1');
    // The next write asks for a new token instead of reusing the old one.
    await user.click(screen.getByRole('button', { name: 'Add a student' }));
    await user.type(await screen.findByLabelText('First name or nickname'), 'Wren');
    await user.selectOptions(screen.getByLabelText('Grade'), '3');
    await user.click(screen.getByRole('button', { name: 'Add student' }));
    await waitFor(() =>
      expect(requests.some((r) => r.path === '/students' && r.method === 'POST')).toBe(true),
    );
    const add = requests.find((r) => r.path === '/students' && r.method === 'POST');
    expect(add?.headers['x-csrf-token']).toBe('csrf-2');
  });

  it('explains a used or expired link and what to do', async () => {
    mockApi({
      'GET /auth/me': signedOut,
      [`GET /invitations/${TOKEN}`]: json(410, {
        statusCode: 410,
        error: 'Gone',
        message: 'This invitation has expired: ask for a new one',
      }),
    });
    renderApp(`/invitations/${TOKEN}`);
    expect(
      await screen.findByText('This invitation has expired: ask for a new one'),
    ).toBeInTheDocument();
    expect(screen.getByText(/send a new invitation from their Members page/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Try again' })).not.toBeInTheDocument();
  });
});
