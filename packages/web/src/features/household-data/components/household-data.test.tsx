import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, tutorMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const signedOut = json(401, { statusCode: 401, error: 'Unauthorized', message: 'Sign in first' });

describe('the owner’s export and deletion', () => {
  it('deletes the household only once its exact name is typed, then signs out', async () => {
    let deleted = false;
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': () => (deleted ? signedOut : json(200, ownerMe)),
      'GET /health': json(200, { status: 'ok', demo: false, version: 't' }),
      'DELETE /households/current': () => {
        deleted = true;
        return json(200, {
          householdId: 10,
          rows: {},
          files: 0,
          accountsClosed: 1,
          yourAccountClosed: true,
        });
      },
    });
    const user = userEvent.setup();
    renderApp('/account');
    await user.click(await screen.findByRole('button', { name: 'Delete the household…' }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText(/including you, if this is your only household/)).toBeVisible();
    const confirm = within(dialog).getByRole('button', { name: 'Delete the household' });
    expect(confirm).toBeDisabled();
    await user.type(within(dialog).getByLabelText(/Type the household’s name/), 'Maple');
    expect(confirm).toBeDisabled();
    await user.type(within(dialog).getByLabelText(/Type the household’s name/), ' Table');
    expect(confirm).toBeEnabled();
    await user.click(confirm);
    await screen.findByRole('heading', { name: 'Sign in' });
    const sent = requests.find((r) => r.method === 'DELETE');
    expect(sent?.body).toEqual({ confirm: 'Maple Table' });
    expect(await screen.findByText(/Maple Table is deleted, and so is your account/)).toBeVisible();
  });

  it('downloads the export as a file', async () => {
    const clicks: string[] = [];
    const original = HTMLAnchorElement.prototype.click;
    HTMLAnchorElement.prototype.click = function click(this: HTMLAnchorElement) {
      clicks.push(this.download);
    };
    URL.createObjectURL = () => 'blob:export';
    URL.revokeObjectURL = () => undefined;
    try {
      mockApi({ 'GET /auth/me': json(200, ownerMe), 'GET /export': json(200, { zip: true }) });
      const user = userEvent.setup();
      renderApp('/account');
      await user.click(await screen.findByRole('button', { name: 'Download the export (zip)' }));
      await waitFor(() => expect(clicks).toEqual(['workback-export.zip']));
      expect(await screen.findByText(/Your export is downloading/)).toBeVisible();
    } finally {
      HTMLAnchorElement.prototype.click = original;
    }
  });

  it('is not offered to anyone but the owner', async () => {
    mockApi({ 'GET /auth/me': json(200, tutorMe) });
    renderApp('/account');
    expect(
      await screen.findByText('Only the household’s owner can export or delete its data.'),
    ).toBeVisible();
    expect(screen.queryByRole('button', { name: /Delete the household/ })).not.toBeInTheDocument();
  });
});
