import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';

import {
  adminMe,
  CSRF,
  json,
  mockApi,
  ownerMe,
  students,
  tutorMe,
} from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

/** A 390 px screen: every max-width query matches, no min-width one does. */
function asPhone() {
  vi.spyOn(window, 'matchMedia').mockImplementation(
    (query: string) =>
      ({
        matches: query.includes('max-width'),
        media: query,
        addEventListener: () => undefined,
        removeEventListener: () => undefined,
      }) as unknown as MediaQueryList,
  );
}

const list = (items: unknown[]) => json(200, { items, total: items.length });

describe('Students page', () => {
  it('lists the students in a table on wide screens', async () => {
    mockApi({ 'GET /auth/me': json(200, ownerMe), 'GET /students': list(students) });
    const { container } = renderApp('/students');
    expect(await screen.findByText('Juniper')).toBeInTheDocument();
    expect(container.querySelector('.bp6-table-container')).not.toBeNull();
    expect(screen.getByText('Grade 4')).toBeInTheDocument();
    expect(screen.getByText('Ollie')).toBeInTheDocument();
    expect(screen.getByText('Grade 2')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Edit Juniper' })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Delete Ollie' })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Add a student' })).toBeInTheDocument();
  });

  it('shows cards instead of a table on a phone', async () => {
    asPhone();
    mockApi({ 'GET /auth/me': json(200, ownerMe), 'GET /students': list(students) });
    const { container } = renderApp('/students');
    const cards = await screen.findByRole('list', { name: 'Students' });
    expect(within(cards).getAllByRole('listitem')).toHaveLength(2);
    expect(within(cards).getByText('Juniper')).toBeInTheDocument();
    expect(within(cards).getByText(/Grade 4 · added/)).toBeInTheDocument();
    expect(container.querySelector('.bp6-table-container')).toBeNull();
  });

  it('lets a tutor read but not change anything', async () => {
    mockApi({ 'GET /auth/me': json(200, tutorMe), 'GET /students': list([students[0]]) });
    renderApp('/students');
    expect(await screen.findByText('Juniper')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Add a student' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^Edit/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^Delete/ })).not.toBeInTheDocument();
    expect(screen.getByText(/Only owners and parents can change them/)).toBeInTheDocument();
  });

  it('tells a site admin why there is nothing to see, without asking for children', async () => {
    const { requests } = mockApi({ 'GET /auth/me': json(200, adminMe) });
    renderApp('/students');
    expect(await screen.findByText('Site admins see no children’s data')).toBeInTheDocument();
    expect(requests.some((r) => r.path === '/students')).toBe(false);
  });

  it('says what to do first when there are no students', async () => {
    mockApi({ 'GET /auth/me': json(200, ownerMe), 'GET /students': list([]) });
    renderApp('/students');
    expect(
      await screen.findByText('No students yet. Add your first child to start a notebook.'),
    ).toBeInTheDocument();
    expect(screen.getAllByRole('button', { name: 'Add a student' })).toHaveLength(1);
  });

  it('shows a loading state, then an error with a way to try again', async () => {
    let fail = true;
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': () =>
        fail ? json(500, { statusCode: 500, message: 'The database is busy' }) : list(students),
    });
    renderApp('/students');
    expect(await screen.findByText('The students could not be loaded.')).toBeInTheDocument();
    expect(screen.getByText('The database is busy')).toBeInTheDocument();
    fail = false;
    await userEvent.setup().click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByText('Juniper')).toBeInTheDocument();
  });

  it('adds a student through the dialog, checking the fields first', async () => {
    let items = [...students];
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /students': () => list(items),
      'POST /students': (request) => {
        const created = {
          ...(request.body as object),
          id: 3,
          createdAt: '2026-09-03T10:00:00.000Z',
          updatedAt: '2026-09-03T10:00:00.000Z',
        } as (typeof students)[number];
        items = [...items, created];
        return json(201, created);
      },
    });
    renderApp('/students');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Add a student' }));
    const dialog = await screen.findByRole('dialog');
    await user.click(within(dialog).getByRole('button', { name: 'Add student' }));
    expect(await within(dialog).findByText('Enter a first name or nickname.')).toBeInTheDocument();
    expect(within(dialog).getByText('Choose a grade.')).toBeInTheDocument();

    await user.type(within(dialog).getByLabelText('First name or nickname'), '  Wren ');
    await user.selectOptions(within(dialog).getByLabelText('Grade'), 'K');
    await user.click(within(dialog).getByRole('button', { name: 'Add student' }));

    expect(await screen.findByText('Added Wren.')).toBeInTheDocument();
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    const table = screen.getByRole('region', { name: 'Students' });
    expect(await within(table).findByText('Wren')).toBeInTheDocument();
    expect(within(table).getByText('Kindergarten')).toBeInTheDocument();
    const post = requests.find((r) => r.method === 'POST' && r.path === '/students');
    expect(post?.body).toEqual({ name: 'Wren', gradeLevel: 'K' });
    expect(requests.filter((r) => r.path === '/students' && r.method === 'GET')).toHaveLength(2);
  });

  it('edits a student and shows the server’s field message in the dialog', async () => {
    let items = [...students];
    mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /students': () => list(items),
      'PATCH /students/1': (request) => {
        const { name } = request.body as { name: string };
        if (name === 'Juniper the Great') {
          return json(400, {
            statusCode: 400,
            message: 'name is too long',
            fields: { name: 'Use a shorter name.' },
          });
        }
        items = items.map((s) => (s.id === 1 ? { ...s, name } : s));
        return json(200, items[0]);
      },
    });
    renderApp('/students');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Edit Juniper' }));
    const dialog = await screen.findByRole('dialog', { name: 'Edit Juniper' });
    const name = within(dialog).getByLabelText('First name or nickname');
    expect(name).toHaveValue('Juniper');
    await user.type(name, ' the Great');
    await user.click(within(dialog).getByRole('button', { name: 'Save changes' }));
    expect(await within(dialog).findByText('Use a shorter name.')).toBeInTheDocument();

    await user.clear(name);
    await user.type(name, 'June');
    await user.click(within(dialog).getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText('Saved June.')).toBeInTheDocument();
    expect(await screen.findByRole('button', { name: 'Edit June' })).toBeInTheDocument();
  });

  it('deletes only after the confirmation', async () => {
    let items = [...students];
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /students': () => list(items),
      'DELETE /students/2': () => {
        items = items.filter((s) => s.id !== 2);
        return json(204);
      },
    });
    renderApp('/students');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Delete Ollie' }));
    const alert = await screen.findByRole('alertdialog');
    expect(alert).toHaveTextContent('Delete Ollie?');
    await user.click(within(alert).getByRole('button', { name: 'Keep' }));
    expect(requests.some((r) => r.method === 'DELETE')).toBe(false);

    await user.click(screen.getByRole('button', { name: 'Delete Ollie' }));
    await user.click(
      within(await screen.findByRole('alertdialog')).getByRole('button', { name: 'Delete' }),
    );
    expect(await screen.findByText('Deleted Ollie.')).toBeInTheDocument();
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Delete Ollie' })).toBeNull());
    expect(requests.filter((r) => r.method === 'DELETE').map((r) => r.path)).toEqual([
      '/students/2',
    ]);
  });
});
