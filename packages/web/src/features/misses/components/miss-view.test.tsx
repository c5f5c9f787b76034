import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { diagnose } from '@workback/core';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, students, tutorMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const list = (items: unknown[]) => json(200, { items, total: items.length });

const photo = {
  id: 31,
  position: 0,
  contentType: 'image/webp',
  width: 1200,
  height: 800,
  bytes: 50_000,
  thumbWidth: 400,
  thumbHeight: 267,
  imageUrl: '/api/photos/31/image',
  thumbUrl: '/api/photos/31/thumb',
  marks: [] as { id?: number; x: number; y: number; label: string | null }[],
  createdAt: '2026-09-14T10:00:00.000Z',
};

function miss(overrides: Record<string, unknown> = {}) {
  const diagnosis = diagnose('304 - 75', '139');
  return {
    id: 12,
    studentId: 1,
    occurredOn: '2026-09-14',
    sittingId: null,
    keyItemId: null,
    problem: '304 - 75',
    answer: '139',
    steps: null,
    explanation: 'The zero stays zero.',
    cause: 'step',
    note: '',
    status: 'logged',
    skills: [],
    revisit: [],
    checked: true,
    notCheckedReason: null,
    expected: '229',
    correct: false,
    ruleIds: ['sub.borrow-across-zero'],
    suggestedCause: 'step',
    engineVersion: '1',
    createdBy: 1,
    updatedBy: 1,
    createdAt: '2026-09-14T10:00:00.000Z',
    updatedAt: '2026-09-14T10:00:00.000Z',
    thumbnailPhotoId: 31,
    photoCount: 1,
    diagnosis: diagnosis.ok ? diagnosis : null,
    photos: [photo],
    ...overrides,
  };
}

const note = {
  id: 1,
  missId: 12,
  body: 'Same zero step as last week.',
  author: { id: 3, displayName: 'Robin' },
  createdAt: '2026-09-15T10:00:00.000Z',
};

function api(me: unknown, extra: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({
    ...CSRF,
    'GET /auth/me': json(200, me),
    'GET /students': list(students),
    'GET /misses/12': json(200, miss()),
    'GET /notes?missId=12&pageSize=100': list([note]),
    ...extra,
  });
}

describe('The miss page', () => {
  it('shows the photo, the working trace, the child’s words, the cause and the notes', async () => {
    api(ownerMe);
    renderApp('/misses/12');
    expect(await screen.findByRole('heading', { name: '304 − 75' })).toBeInTheDocument();
    expect(screen.getByText(/Juniper/)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: /^Photo 1/ })).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'The usual working' })).toBeInTheDocument();
    expect(screen.getByText('The zero stays zero.')).toBeInTheDocument();
    const cause = screen.getByRole('region', { name: 'Cause' });
    expect(within(cause).getByText('Method step')).toBeInTheDocument();
    expect(await screen.findByText('Same zero step as last week.')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Logged' })).toHaveAttribute('aria-pressed', 'true');
  });

  it('moves the status along with one tap', async () => {
    const { requests } = api(ownerMe, {
      'PATCH /misses/12': json(200, miss({ status: 'discussed' })),
    });
    renderApp('/misses/12');
    await userEvent.setup().click(await screen.findByRole('button', { name: 'Talked through' }));
    expect(await screen.findByText('Marked “Talked through”.')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ status: 'discussed' });
    expect(screen.getByRole('button', { name: 'Talked through' })).toHaveAttribute(
      'aria-pressed',
      'true',
    );
  });

  it('places a pin where the photo is tapped and stores it as fractions', async () => {
    const { requests } = api(ownerMe, {
      'PUT /photos/31/marks': (request) => {
        const { marks } = request.body as { marks: { x: number; y: number; label?: string }[] };
        return json(200, {
          ...photo,
          marks: marks.map((m, i) => ({ id: i + 1, label: null, ...m })),
        });
      },
    });
    renderApp('/misses/12');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: /^Photo 1/ }));
    const dialog = await screen.findByRole('dialog');
    const target = within(dialog).getByRole('button', { name: 'Photo 1: tap to place a pin' });
    target.getBoundingClientRect = () =>
      ({ left: 100, top: 50, width: 400, height: 200, right: 500, bottom: 250 }) as DOMRect;
    fireEvent.click(target, { clientX: 200, clientY: 100 });
    await user.type(within(dialog).getByLabelText('Words for pin 1'), 'borrowed here');
    await user.click(within(dialog).getByRole('button', { name: 'Save pins' }));
    expect(await screen.findByText('Saved 1 pin.')).toBeInTheDocument();
    const put = requests.find((r) => r.method === 'PUT');
    expect(put?.path).toBe('/photos/31/marks');
    expect(put?.body).toEqual({ marks: [{ x: 0.25, y: 0.25, label: 'borrowed here' }] });
    await user.click(within(dialog).getByRole('button', { name: 'Done' }));
    expect(await screen.findByText(/Photo 1 · 1 pin/)).toBeInTheDocument();
  });

  it('adds a note to the thread', async () => {
    let notes = [note];
    const { requests } = api(ownerMe, {
      'GET /notes?missId=12&pageSize=100': () => list(notes),
      'POST /notes': (request) => {
        const created = { ...note, id: 2, body: (request.body as { body: string }).body };
        notes = [...notes, created];
        return json(201, created);
      },
    });
    renderApp('/misses/12');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Add note' }));
    expect(await screen.findByText('Write something first.')).toBeVisible();
    await user.type(screen.getByRole('textbox', { name: 'Add a note' }), '  Try base-ten blocks. ');
    await user.click(screen.getByRole('button', { name: 'Add note' }));
    expect(await screen.findByText('Try base-ten blocks.')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST' && r.path === '/notes')?.body).toEqual({
      missId: 12,
      body: 'Try base-ten blocks.',
    });
    expect(screen.getByRole('textbox', { name: 'Add a note' })).toHaveValue('');
  });

  it('deletes only after asking, then goes back to the notebook', async () => {
    const { requests } = api(ownerMe, {
      'DELETE /misses/12': json(204),
      'GET /misses?sort=-occurredOn&page=1&pageSize=25': json(200, {
        items: [],
        total: 0,
        page: 1,
        pageSize: 25,
      }),
    });
    const { router } = renderApp('/misses/12');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Delete' }));
    const alert = await screen.findByRole('alertdialog');
    expect(within(alert).getByText(/Its photos, pins and notes go too/)).toBeInTheDocument();
    await user.click(within(alert).getByRole('button', { name: 'Keep' }));
    expect(requests.some((r) => r.method === 'DELETE')).toBe(false);
    await waitFor(() => expect(screen.queryByRole('alertdialog')).toBeNull());
    await user.click(screen.getByRole('button', { name: 'Delete' }));
    await user.click(
      within(await screen.findByRole('alertdialog')).getByRole('button', { name: 'Delete' }),
    );
    await waitFor(() => expect(router.state.location.pathname).toBe('/notebook'));
    expect(requests.filter((r) => r.method === 'DELETE').map((r) => r.path)).toEqual([
      '/misses/12',
    ]);
  });

  it('edits the miss, sending only the form’s fields', async () => {
    const { requests } = api(ownerMe, {
      'PATCH /misses/12': (request) => json(200, miss(request.body as Record<string, unknown>)),
    });
    renderApp('/misses/12');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Edit' }));
    const dialog = await screen.findByRole('dialog');
    await user.click(within(dialog).getByRole('radio', { name: /Slip/ }));
    await user.click(within(dialog).getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText('Saved the changes.')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({
      occurredOn: '2026-09-14',
      problem: '304 - 75',
      answer: '139',
      explanation: 'The zero stays zero.',
      cause: 'slip',
      note: '',
    });
  });

  it('lets a tutor read, pin and add notes, but not classify, move or delete', async () => {
    api(tutorMe);
    renderApp('/misses/12');
    expect(await screen.findByRole('heading', { name: '304 − 75' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Edit' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Delete' })).toBeNull();
    expect(screen.queryByRole('group', { name: 'Where this miss stands' })).toBeNull();
    expect(screen.getByText(/Only the family changes the cause/)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Add note' })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: /^Photo 1/ })).toBeInTheDocument();
  });

  it('says plainly when a problem was not checked', async () => {
    api(ownerMe, {
      'GET /misses/12': json(
        200,
        miss({
          problem: 'A bus seats 48 people and 19 are on it. How many seats are empty?',
          diagnosis: null,
          checked: false,
          notCheckedReason: 'This reads as words, not a sum the checkers can work.',
          photos: [],
        }),
      ),
    });
    renderApp('/misses/12');
    expect(await screen.findByText('Not checked')).toBeInTheDocument();
    expect(screen.getByText(/This reads as words/)).toBeInTheDocument();
    expect(screen.getByText(/No photos/)).toBeInTheDocument();
  });

  it('says so when the miss is not there or not this household’s', async () => {
    api(ownerMe, {
      'GET /misses/12': json(404, { statusCode: 404, message: 'No miss 12 in this household' }),
    });
    renderApp('/misses/12');
    expect(await screen.findByText('This miss could not be loaded.')).toBeInTheDocument();
    expect(screen.getByText(/has not been shared with you/)).toBeInTheDocument();
    // Nothing to retry: the miss is not there for this reader.
    expect(screen.queryByRole('button', { name: 'Try again' })).not.toBeInTheDocument();
  });
});
