import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const signedOut = json(401, { statusCode: 401, error: 'Unauthorized', message: 'Sign in first' });
const health = (demo: boolean) => json(200, { status: 'ok', demo, version: 'test' });

async function openSignIn(handlers: Parameters<typeof mockApi>[0], demo = false) {
  const api = mockApi({
    ...CSRF,
    'GET /health': health(demo),
    'GET /auth/me': signedOut,
    ...handlers,
  });
  const view = renderApp('/sign-in');
  await screen.findByRole('heading', { name: 'Sign in' });
  return { ...api, ...view, user: userEvent.setup() };
}

describe('sign-in form', () => {
  it('shows what is missing next to each field and sends nothing', async () => {
    const { user, requests } = await openSignIn({});
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter the e-mail you signed up with.')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAccessibleDescription(
      'Enter the e-mail you signed up with.',
    );
    expect(screen.getByLabelText('Password')).toHaveAccessibleDescription('Enter your password.');
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(requests.some((r) => r.path === '/auth/login')).toBe(false);
  });

  it('checks the e-mail looks like one', async () => {
    const { user } = await openSignIn({});
    await user.type(screen.getByLabelText('E-mail'), 'not-an-email');
    await user.type(screen.getByLabelText('Password'), 'whatever1');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(
      await screen.findByText('That does not look like an e-mail address.'),
    ).toBeInTheDocument();
  });

  it('says plainly when the e-mail and password do not match', async () => {
    const { user, requests } = await openSignIn({
      'POST /auth/login': json(401, { statusCode: 401, message: 'Invalid credentials' }),
    });
    await user.type(screen.getByLabelText('E-mail'), 'sam@example.test');
    await user.type(screen.getByLabelText('Password'), 'wrong password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'That e-mail and password do not match an account.',
    );
    const login = requests.find((r) => r.path === '/auth/login');
    expect(login?.body).toEqual({ email: 'sam@example.test', password: 'wrong password' });
    expect(login?.headers['x-csrf-token']).toBe('csrf-1');
  });

  it('asks to wait after too many tries', async () => {
    const { user } = await openSignIn({
      'POST /auth/login': json(429, { statusCode: 429, message: 'ThrottlerException' }),
    });
    await user.type(screen.getByLabelText('E-mail'), 'sam@example.test');
    await user.type(screen.getByLabelText('Password'), 'wrong password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(/too many tries — wait a minute/i);
  });

  it('opens the students page after signing in', async () => {
    const { user, router } = await openSignIn({
      'POST /auth/login': json(200, ownerMe),
      'GET /students': json(200, { items: [], total: 0 }),
    });
    await user.type(screen.getByLabelText('E-mail'), ' sam@example.test ');
    await user.type(screen.getByLabelText('Password'), 'right password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/students'));
    expect(
      await screen.findByText('No students yet. Add your first child to start a notebook.'),
    ).toBeInTheDocument();
  });

  it('hides the demo sign-ins unless the server runs the demo', async () => {
    await openSignIn({});
    expect(screen.queryByText('Try the demo household')).not.toBeInTheDocument();
  });

  it('lists the demo sign-ins in demo mode and fills the form from one', async () => {
    const { user } = await openSignIn({}, true);
    expect(await screen.findByText('Try the demo household')).toBeInTheDocument();
    for (const email of [
      'parent@workback.test',
      'coparent@workback.test',
      'tutor@workback.test',
      'admin@workback.test',
    ]) {
      expect(screen.getByRole('button', { name: new RegExp(`^${email}`) })).toBeInTheDocument();
    }
    await user.click(screen.getByRole('button', { name: /^tutor@workback\.test/ }));
    expect(screen.getByLabelText('E-mail')).toHaveValue('tutor@workback.test');
    expect(screen.getByLabelText('Password')).toHaveValue('workback-demo');
  });
});
