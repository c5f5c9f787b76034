import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, students } from '../../testing/mock-api';
import { renderApp } from '../../testing/render';

const signedOut = json(401, { statusCode: 401, error: 'Unauthorized', message: 'Sign in first' });

describe('signed-in pages', () => {
  it('send a signed-out visitor to sign in, then back to the page they asked for', async () => {
    let signedIn = false;
    mockApi({
      ...CSRF,
      'GET /health': json(200, { status: 'ok', demo: false, version: 'test' }),
      'GET /auth/me': () => (signedIn ? json(200, ownerMe) : signedOut),
      'POST /auth/login': () => {
        signedIn = true;
        return json(200, ownerMe);
      },
      'GET /students': json(200, { items: students, total: 2 }),
    });
    const { router } = renderApp('/account');

    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?redirectTo=%2Faccount');

    const user = userEvent.setup();
    await user.type(screen.getByLabelText('E-mail'), 'sam@example.test');
    await user.type(screen.getByLabelText('Password'), 'long enough');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { name: 'Account' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/account');
    expect(screen.getAllByText('Maple Table').length).toBeGreaterThan(0);
  });

  it('show the shell with household, person and navigation once signed in', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': json(200, { items: students, total: 2 }),
    });
    const { router } = renderApp('/');
    expect(await screen.findByRole('heading', { name: 'Students' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/students');
    const nav = screen.getByRole('navigation', { name: 'Main' });
    expect(nav).toHaveTextContent('Students');
    expect(nav).toHaveTextContent('Account');
    expect(screen.getAllByText('Sam')[0]).toBeInTheDocument();
    expect(screen.getAllByRole('button', { name: 'Sign out' }).length).toBeGreaterThan(0);
  });

  it('return to sign in when the session ends while a page is open', async () => {
    let expired = false;
    mockApi({
      'GET /auth/me': () => (expired ? signedOut : json(200, ownerMe)),
      'GET /students': () => (expired ? signedOut : json(200, { items: students, total: 2 })),
    });
    const { router, queryClient } = renderApp('/students');
    expect(await screen.findByText('Juniper')).toBeInTheDocument();
    expired = true;
    await queryClient.refetchQueries({ queryKey: ['students'] });
    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
  });

  it('keep a signed-in person away from the sign-in page', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': json(200, { items: [], total: 0 }),
    });
    const { router } = renderApp('/sign-in');
    await waitFor(() => expect(router.state.location.pathname).toBe('/students'));
  });

  it('sign out, forget the household, and land on sign in', async () => {
    let signedIn = true;
    const { requests } = mockApi({
      ...CSRF,
      'GET /health': json(200, { status: 'ok', demo: false, version: 'test' }),
      'GET /auth/me': () => (signedIn ? json(200, ownerMe) : signedOut),
      'POST /auth/logout': () => {
        signedIn = false;
        return json(204);
      },
      'GET /students': json(200, { items: students, total: 2 }),
    });
    const { router, queryClient } = renderApp('/students');
    await screen.findByText('Juniper');
    await userEvent.setup().click(screen.getAllByRole('button', { name: 'Sign out' })[0]!);
    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(requests.find((r) => r.path === '/auth/logout')?.headers['x-csrf-token']).toBe('csrf-1');
    expect(queryClient.getQueryData(['students', 'list'])).toBeUndefined();
  });

  it('explain a mistyped address instead of showing a blank page', async () => {
    mockApi({ 'GET /auth/me': json(200, ownerMe) });
    renderApp('/no-such-page');
    expect(
      await screen.findByRole('heading', { name: 'This page is not here' }),
    ).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to your students' })).toHaveAttribute(
      'href',
      '/students',
    );
  });

  it('offer a reload when the server cannot be reached at all', async () => {
    const { fetchMock } = mockApi({});
    fetchMock.mockRejectedValue(new TypeError('Failed to fetch'));
    renderApp('/students');
    expect(
      await screen.findByRole('heading', { name: 'This page did not load' }),
    ).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Reload' })).toBeInTheDocument();
  });
});
