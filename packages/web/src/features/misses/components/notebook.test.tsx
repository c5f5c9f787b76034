import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';

import { json, mockApi, ownerMe, students, tutorMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';
import { formatDay } from '../types';

const list = (items: unknown[]) => json(200, { items, total: items.length });

function row(id: number, overrides: Record<string, unknown> = {}) {
  return {
    id,
    studentId: 1,
    occurredOn: '2026-09-14',
    sittingId: null,
    keyItemId: null,
    problem: '304 - 75',
    answer: '139',
    steps: null,
    explanation: '',
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
    thumbnailPhotoId: 9,
    photoCount: 1,
    ...overrides,
  };
}

const page = (items: unknown[], total = items.length, pageNo = 1) =>
  json(200, { items, total, page: pageNo, pageSize: 25 });

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

const missRequests = (requests: { method: string; path: string }[]) =>
  requests.filter((r) => r.method === 'GET' && r.path.startsWith('/misses?')).map((r) => r.path);

describe('Notebook', () => {
  it('maps the address bar’s filters to the server query', async () => {
    const { requests } = mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': list(students),
      'GET /misses?studentId=2&cause=fact&rule=mul.fact&from=2026-09-01&q=7+x&sort=problem&page=2&pageSize=25':
        page(
          [row(3, { studentId: 2, problem: '7 x 8', answer: '54', ruleIds: ['mul.fact'] })],
          26,
          2,
        ),
    });
    renderApp(
      '/notebook?student=2&cause=fact&rule=mul.fact&from=2026-09-01&q=7%20x&sort=problem&page=2&to=soon',
    );
    const table = await screen.findByRole('region', { name: 'Misses' });
    expect(await within(table).findByText('7 x 8')).toBeInTheDocument();
    expect(within(table).getByText('Ollie')).toBeInTheDocument();
    expect(screen.getByText(/Showing 26–26 of 26 misses/)).toBeInTheDocument();
    expect(screen.getByText('Page 2 of 2')).toBeInTheDocument();
    // A date the server would refuse ("soon") is left out rather than sent.
    expect(missRequests(requests).every((p) => !p.includes('to='))).toBe(true);
    expect(screen.getByLabelText('Search')).toHaveValue('7 x');
    expect(screen.getByLabelText('Cause')).toHaveValue('fact');
  });

  it('writes a changed filter to the URL, back to page 1, and asks the server again', async () => {
    const { requests } = mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': list(students),
      'GET /misses?sort=-occurredOn&page=3&pageSize=25': page([row(1)], 60, 3),
      'GET /misses?status=resolved&sort=-occurredOn&page=1&pageSize=25': page([
        row(2, { status: 'resolved', problem: '52 - 27' }),
      ]),
    });
    const { router } = renderApp('/notebook?page=3');
    await screen.findByText(/Showing 51–51 of 60/);
    await userEvent.setup().selectOptions(screen.getByLabelText('Status'), 'resolved');
    await waitFor(() => expect(router.state.location.search).toBe('?status=resolved'));
    const table = screen.getByRole('region', { name: 'Misses' });
    expect(await within(table).findByText('52 - 27')).toBeInTheDocument();
    expect(missRequests(requests)).toContain(
      '/misses?status=resolved&sort=-occurredOn&page=1&pageSize=25',
    );
  });

  it('types a search into the URL once typing pauses', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': list(students),
      'GET /misses?sort=-occurredOn&page=1&pageSize=25': page([row(1)]),
      'GET /misses?q=zero&sort=-occurredOn&page=1&pageSize=25': page([row(1)]),
    });
    const { router } = renderApp('/notebook');
    await screen.findByRole('region', { name: 'Misses' });
    await userEvent.setup().type(screen.getByLabelText('Search'), 'zero');
    await waitFor(() => expect(router.state.location.search).toBe('?q=zero'));
  });

  it('pages forward with Next', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': list(students),
      'GET /misses?sort=-occurredOn&page=1&pageSize=25': page([row(1)], 30),
      'GET /misses?sort=-occurredOn&page=2&pageSize=25': page(
        [row(2, { problem: '9 + 7' })],
        30,
        2,
      ),
    });
    const { router } = renderApp('/notebook');
    await screen.findByText('Page 1 of 2');
    await userEvent.setup().click(screen.getByRole('button', { name: 'Next' }));
    await waitFor(() => expect(router.state.location.search).toBe('?page=2'));
    expect(await screen.findByText('9 + 7')).toBeInTheDocument();
  });

  it('opens a miss from its row', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': list(students),
      'GET /misses?sort=-occurredOn&page=1&pageSize=25': page([row(4)]),
    });
    const { router } = renderApp('/notebook');
    const table = await screen.findByRole('region', { name: 'Misses' });
    // Any square of the row opens it, not only the problem's link.
    await userEvent.setup().click(await within(table).findByText(formatDay('2026-09-14')));
    await waitFor(() => expect(router.state.location.pathname).toBe('/misses/4'));
  });

  it('shows cards on a phone, each a link to its miss, with the thumbnail', async () => {
    asPhone();
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': list(students),
      'GET /misses?sort=-occurredOn&page=1&pageSize=25': page([
        row(4),
        row(5, { thumbnailPhotoId: null }),
      ]),
    });
    const { container } = renderApp('/notebook');
    const cards = await screen.findByRole('list', { name: 'Misses' });
    expect(within(cards).getAllByRole('listitem')).toHaveLength(2);
    expect(within(cards).getAllByRole('link', { name: '304 - 75' })[0]).toHaveAttribute(
      'href',
      '/misses/4',
    );
    expect(container.querySelector('img.wb-thumb')?.getAttribute('src')).toBe(
      '/api/photos/9/small',
    );
    expect(container.querySelector('.bp6-table-container')).toBeNull();
    const first = within(cards).getAllByRole('listitem')[0] as HTMLElement;
    expect(within(first).getByText('Method step')).toBeInTheDocument();
    expect(within(first).getByText('Logged')).toBeInTheDocument();
    expect(within(first).getByText('Zeros skipped when regrouping')).toBeInTheDocument();
    expect(within(first).getByText(/Juniper/)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'More filters' })).toBeInTheDocument();
  });

  it('says what to do first when nothing is logged, and how to undo filters that match nothing', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': list(students),
      'GET /misses?sort=-occurredOn&page=1&pageSize=25': page([]),
      'GET /misses?cause=copying&sort=-occurredOn&page=1&pageSize=25': page([]),
    });
    const { router } = renderApp('/notebook');
    expect(
      await screen.findByText('No misses logged yet. After the next worksheet, log the first one.'),
    ).toBeInTheDocument();
    await router.navigate('/notebook?cause=copying');
    expect(
      await screen.findByText('No misses match these filters. Clear them to see every miss.'),
    ).toBeInTheDocument();
    await userEvent.setup().click(screen.getAllByRole('button', { name: 'Clear filters' })[0]!);
    await waitFor(() => expect(router.state.location.search).toBe(''));
  });

  it('shows an error with a way to try again', async () => {
    let fail = true;
    mockApi({
      'GET /auth/me': json(200, tutorMe),
      'GET /students': list([students[0]]),
      'GET /misses?sort=-occurredOn&page=1&pageSize=25': () =>
        fail ? json(500, { statusCode: 500, message: 'The database is busy' }) : page([row(1)]),
    });
    renderApp('/notebook');
    expect(await screen.findByText('The notebook could not be loaded.')).toBeInTheDocument();
    fail = false;
    await userEvent.setup().click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByText('304 - 75')).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: /Log a miss/ })).toBeNull();
  });
});
