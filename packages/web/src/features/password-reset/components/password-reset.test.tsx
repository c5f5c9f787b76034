import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const signedOut = json(401, { statusCode: 401, error: 'Unauthorized', message: 'Sign in first' });
const SAME_ANSWER =
  'If that e-mail has a Workback account, a link to set a new password is on its way. It works once, for one hour.';

describe('password reset', () => {
  it('is reached from the sign-in page and always gives the same answer', async () => {
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': signedOut,
      'GET /health': json(200, { status: 'ok', demo: false, version: 't' }),
      'POST /auth/password-reset': json(202, { message: SAME_ANSWER }),
    });
    const user = userEvent.setup();
    renderApp('/sign-in');
    await user.click(await screen.findByRole('link', { name: 'Forgot your password?' }));
    await screen.findByRole('heading', { name: 'Forgot your password?' });
    await user.type(screen.getByLabelText('E-mail'), 'nobody@example.test');
    await user.click(screen.getByRole('button', { name: 'E-mail me a link' }));
    expect(await screen.findByRole('status')).toHaveTextContent(SAME_ANSWER);
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      email: 'nobody@example.test',
    });
  });

  it('sets a new password from the link, after checking both entries agree', async () => {
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': signedOut,
      'GET /health': json(200, { status: 'ok', demo: false, version: 't' }),
      'POST /auth/password-reset/confirm': json(200, {
        message: 'Your new password is set. Please sign in with it.',
      }),
    });
    const user = userEvent.setup();
    renderApp('/reset-password/tok_1');
    await user.type(await screen.findByLabelText('New password'), 'a new long one');
    await user.type(screen.getByLabelText('The new password again'), 'a new long on');
    await user.click(screen.getByRole('button', { name: 'Set new password' }));
    expect(await screen.findByText('The two passwords are not the same.')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);

    await user.type(screen.getByLabelText('The new password again'), 'e');
    await user.click(screen.getByRole('button', { name: 'Set new password' }));
    await screen.findByRole('heading', { name: 'Sign in' });
    expect(
      await screen.findByText('Your new password is set. Please sign in with it.'),
    ).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      token: 'tok_1',
      password: 'a new long one',
    });
  });

  it('says when the link was already used, and offers a new one', async () => {
    mockApi({
      ...CSRF,
      'GET /auth/me': signedOut,
      'POST /auth/password-reset/confirm': json(410, {
        statusCode: 410,
        error: 'Gone',
        message: 'This password link has already been used: ask for a new one',
      }),
    });
    const user = userEvent.setup();
    renderApp('/reset-password/tok_1');
    await user.type(await screen.findByLabelText('New password'), 'a new long one');
    await user.type(screen.getByLabelText('The new password again'), 'a new long one');
    await user.click(screen.getByRole('button', { name: 'Set new password' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'This password link has already been used: ask for a new one',
    );
    expect(
      screen.getByRole('link', { name: 'Ask for a new link to set your password' }),
    ).toHaveAttribute('href', '/forgot-password');
  });
});
