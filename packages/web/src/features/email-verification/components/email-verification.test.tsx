import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, students } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const unconfirmed = { ...ownerMe, user: { ...ownerMe.user, emailVerified: false } };
const confirmed = { ...ownerMe, user: { ...ownerMe.user, emailVerified: true } };
const list = (items: unknown[]) => json(200, { items, total: items.length });
const SENT = 'A link to confirm your address is on its way. It works once, for 48 hours.';

describe('confirming the e-mail address', () => {
  it('asks an unconfirmed account to confirm, and sends a new link on request', async () => {
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': json(200, unconfirmed),
      'GET /students': list(students),
      'POST /auth/email-verification': json(202, { message: SENT }),
    });
    const user = userEvent.setup();
    renderApp('/students');
    expect(await screen.findByText('Please confirm your e-mail address')).toBeInTheDocument();
    expect(screen.getByText('sam@example.test')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Send a new link' }));
    expect(await screen.findByRole('status')).toHaveTextContent(SENT);
    expect(requests.filter((r) => r.path === '/auth/email-verification')).toHaveLength(1);
  });

  it('says nothing to a confirmed account', async () => {
    mockApi({ 'GET /auth/me': json(200, confirmed), 'GET /students': list(students) });
    renderApp('/students');
    expect(await screen.findByText('Juniper')).toBeInTheDocument();
    expect(screen.queryByText('Please confirm your e-mail address')).toBeNull();
  });

  it('confirms from the mailed link only when asked, then offers the way in', async () => {
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': json(401, { statusCode: 401, error: 'Unauthorized', message: 'Sign in' }),
      'POST /auth/email-verification/confirm': json(200, {
        message: 'Thank you: sam@example.test is confirmed.',
        email: 'sam@example.test',
      }),
    });
    const user = userEvent.setup();
    renderApp('/verify-email/tok_1');
    await screen.findByRole('heading', { name: 'Confirm your e-mail address' });
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
    await user.click(screen.getByRole('button', { name: 'Confirm my address' }));
    expect(await screen.findByRole('status')).toHaveTextContent(
      'Thank you: sam@example.test is confirmed.',
    );
    expect(screen.getByRole('link', { name: 'Open Workback' })).toHaveAttribute('href', '/');
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ token: 'tok_1' });
  });

  it('says plainly when the link was already used, and how to get a new one', async () => {
    mockApi({
      ...CSRF,
      'GET /auth/me': json(401, { statusCode: 401, error: 'Unauthorized', message: 'Sign in' }),
      'POST /auth/email-verification/confirm': json(410, {
        statusCode: 410,
        error: 'Gone',
        message: 'This confirmation link has already been used (only the newest link works)',
      }),
    });
    const user = userEvent.setup();
    renderApp('/verify-email/tok_1');
    await user.click(await screen.findByRole('button', { name: 'Confirm my address' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(/already been used/);
    expect(screen.getByText(/Send a new link/)).toBeInTheDocument();
  });
});
