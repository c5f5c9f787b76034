import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const signedOut = json(401, { statusCode: 401, error: 'Unauthorized', message: 'Sign in first' });

async function openCreateAccount(handlers: Parameters<typeof mockApi>[0] = {}) {
  const api = mockApi({ ...CSRF, 'GET /auth/me': signedOut, ...handlers });
  const view = renderApp('/create-account');
  await screen.findByRole('heading', { name: 'Create an account' });
  return { ...api, ...view, user: userEvent.setup() };
}

async function fillIn(user: ReturnType<typeof userEvent.setup>, password = 'kitchen table 42') {
  await user.type(screen.getByLabelText('Household name'), 'Maple Table');
  await user.type(screen.getByLabelText('Your name'), 'Sam');
  await user.type(screen.getByLabelText('E-mail'), 'sam@example.test');
  await user.type(screen.getByLabelText('Password'), password);
}

const adultBox = () => screen.getByRole('checkbox', { name: /I am an adult/ });

describe('create-account form', () => {
  it('shows the privacy cautions before anyone signs up', async () => {
    await openCreateAccount();
    const caution = screen.getByRole('region', { name: /about your children’s data/i });
    expect(caution).toHaveTextContent(/first name or nickname and a grade/);
    expect(caution).toHaveTextContent(/export everything, or delete it/);
    expect(caution).toHaveTextContent(/Location and camera details are removed/);
    expect(caution).toHaveTextContent(/One household never sees another/);
    expect(caution).toHaveTextContent(
      /local rules on children’s privacy and on homeschool records/,
    );
    expect(caution).toHaveTextContent(/does not claim to meet/);
    expect(caution).toHaveTextContent(/do not grade or assess your child/);
  });

  it('will not go on without the adult and parent confirmation', async () => {
    const { user, requests } = await openCreateAccount();
    await fillIn(user);
    await user.click(screen.getByRole('button', { name: 'Create account' }));
    expect(
      await screen.findByText(/Only a parent or guardian can create a household/),
    ).toBeInTheDocument();
    expect(adultBox()).toHaveAccessibleDescription(/Tick the box to go on/);
    expect(requests.some((r) => r.path === '/auth/register')).toBe(false);
  });

  it('checks every field and the password length next to each field', async () => {
    const { user } = await openCreateAccount();
    await user.type(screen.getByLabelText('Password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Create account' }));
    expect(await screen.findByText('Give your household a name.')).toBeInTheDocument();
    expect(screen.getByText('Tell us what to call you.')).toBeInTheDocument();
    expect(screen.getByText('Enter your e-mail address.')).toBeInTheDocument();
    expect(screen.getByLabelText('Password')).toHaveAccessibleDescription(
      'Use at least 8 characters.',
    );

    await user.clear(screen.getByLabelText('Password'));
    await user.click(screen.getByLabelText('Password'));
    await user.paste('x'.repeat(129));
    await user.click(screen.getByRole('button', { name: 'Create account' }));
    expect(await screen.findByText('Use at most 128 characters.')).toBeInTheDocument();
  });

  it('creates the household and opens the students page', async () => {
    const { user, requests, router } = await openCreateAccount({
      'POST /auth/register': json(201, ownerMe),
      'GET /students': json(200, { items: [], total: 0 }),
    });
    await fillIn(user);
    await user.click(adultBox());
    await user.click(screen.getByRole('button', { name: 'Create account' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/students'));
    const register = requests.find((r) => r.path === '/auth/register');
    expect(register?.body).toEqual({
      householdName: 'Maple Table',
      displayName: 'Sam',
      email: 'sam@example.test',
      password: 'kitchen table 42',
      adultConfirmed: true,
    });
    expect(register?.headers['x-csrf-token']).toBe('csrf-1');
  });

  it('puts the server’s field messages next to the fields', async () => {
    const { user } = await openCreateAccount({
      'POST /auth/register': json(400, {
        statusCode: 400,
        error: 'Bad Request',
        message: 'email must be an email',
        fields: { email: 'Use a full e-mail address such as name@example.org.' },
      }),
    });
    await fillIn(user);
    await user.click(adultBox());
    await user.click(screen.getByRole('button', { name: 'Create account' }));
    expect(
      await screen.findByText('Use a full e-mail address such as name@example.org.'),
    ).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('points to sign in when the e-mail already has an account', async () => {
    const { user } = await openCreateAccount({
      'POST /auth/register': json(409, { statusCode: 409, message: 'E-mail already registered' }),
    });
    await fillIn(user);
    await user.click(adultBox());
    await user.click(screen.getByRole('button', { name: 'Create account' }));
    expect(await screen.findByText(/already exists. Sign in instead/)).toBeInTheDocument();
  });
});
