import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { checkLines } from '@workback/core';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { fakeUploads } from '../../../testing/fake-xhr';
import { CSRF, json, mockApi, ownerMe, students } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const list = (items: unknown[]) => json(200, { items, total: items.length });

// An invented word problem: 4 boxes of 15 pencils, 18 given away, 7 bought. 60 − 18 is 42, so
// the second line (58) differs and the third (58 + 7 = 65) goes on with it.
const LINES = ['4 x 15 = 60', '60 - 18 = 58', '58 + 7 = 65'];

function wordMiss(overrides: Record<string, unknown> = {}) {
  return {
    id: 21,
    studentId: 1,
    occurredOn: '2026-09-14',
    sittingId: null,
    keyItemId: null,
    problem: 'Pencils: 4 boxes of 15, 18 given away, 7 bought',
    answer: '65',
    steps: null,
    explanation: '',
    cause: 'step',
    note: '',
    status: 'logged',
    skills: [],
    revisit: [],
    lines: LINES,
    stage: 'process',
    checked: false,
    notCheckedReason: 'I could not read the word “Pencils”.',
    expected: null,
    correct: null,
    ruleIds: ['sub.smaller-from-larger'],
    suggestedCause: 'step',
    engineVersion: null,
    createdBy: 1,
    updatedBy: 1,
    createdAt: '2026-09-14T10:00:00.000Z',
    updatedAt: '2026-09-14T10:00:00.000Z',
    thumbnailPhotoId: null,
    photoCount: 0,
    diagnosis: null,
    photos: [],
    linesCheck: checkLines(LINES),
    ...overrides,
  };
}

function api(extra: Parameters<typeof mockApi>[0] = {}) {
  return mockApi({
    ...CSRF,
    'GET /auth/me': json(200, ownerMe),
    'GET /students': list(students),
    ...extra,
  });
}

beforeEach(() => window.localStorage.clear());
afterEach(() => {
  window.localStorage.clear();
  vi.restoreAllMocks();
});

async function fillWordProblem(user: ReturnType<typeof userEvent.setup>) {
  await user.selectOptions(await screen.findByLabelText('Student'), 'Juniper');
  await user.type(screen.getByLabelText('The problem'), 'Pencils: 4 boxes of 15');
  await user.type(screen.getByLabelText('The child’s answer'), '65');
  expect(screen.queryByLabelText('The number sentences the child wrote')).toBeNull();
  const toggle = screen.getByRole('button', { name: 'Word problem' });
  expect(toggle).toHaveAttribute('aria-expanded', 'false');
  await user.click(toggle);
  expect(toggle).toHaveAttribute('aria-expanded', 'true');
  await user.type(
    screen.getByLabelText('The number sentences the child wrote'),
    `${LINES.join('\n')}\n\n`,
  );
}

describe('Log a miss: word problem', () => {
  it('keeps the section closed until asked, then sends the lines and the stage', async () => {
    api({
      'GET /misses/21': json(200, wordMiss()),
      'GET /notes?missId=21&pageSize=100': list([]),
    });
    const uploads = fakeUploads({ status: 201, body: wordMiss() });
    const { router } = renderApp('/misses/new');
    const user = userEvent.setup();
    await fillWordProblem(user);
    expect(
      screen.getByText(/whether the sentences answer the question stays your call/i),
    ).toBeVisible();
    await user.click(screen.getByRole('radio', { name: /“Work it”/ }));
    await user.click(screen.getByRole('button', { name: 'Save' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/misses/21'));
    expect(uploads.sent).toHaveLength(1);
    expect(uploads.sent[0]?.fields).toMatchObject({
      problem: 'Pencils: 4 boxes of 15',
      answer: '65',
      lines: JSON.stringify(LINES),
      stage: 'process',
    });
  });

  it('sends no lines when the section stays closed', async () => {
    api();
    const uploads = fakeUploads({ status: 201, body: wordMiss({ lines: null, linesCheck: null }) });
    renderApp('/misses/new');
    const user = userEvent.setup();
    await user.selectOptions(await screen.findByLabelText('Student'), 'Juniper');
    await user.type(screen.getByLabelText('The problem'), '304 - 75');
    await user.type(screen.getByLabelText('The child’s answer'), '139');
    await user.click(screen.getByRole('button', { name: 'Save' }));
    await waitFor(() => expect(uploads.sent).toHaveLength(1));
    expect(uploads.sent[0]?.fields).not.toHaveProperty('lines');
    expect(uploads.sent[0]?.fields).not.toHaveProperty('stage');
  });

  it('shows a line the server refused under the lines, naming the line', async () => {
    api();
    fakeUploads({
      status: 400,
      body: {
        statusCode: 400,
        error: 'Bad Request',
        message: 'Please check lines.1: Line 2 has no “=”',
        fields: { 'lines.1': 'Line 2 has no “=”' },
      },
    });
    renderApp('/misses/new');
    const user = userEvent.setup();
    await fillWordProblem(user);
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(await screen.findByText('Line 2: Line 2 has no “=”')).toBeVisible();
    expect(screen.getByLabelText('The number sentences the child wrote')).toHaveValue(
      `${LINES.join('\n')}\n\n`,
    );
  });
});

describe('Log a miss: the cause follows the interview stage', () => {
  it('offers the stage’s cause as it is chosen, until a cause is picked by hand', async () => {
    api();
    renderApp('/misses/new');
    const user = userEvent.setup();
    await fillWordProblem(user);
    const cause = (name: RegExp) => screen.getByRole('radio', { name });
    await user.click(screen.getByRole('radio', { name: /“Read it to me”/ }));
    await waitFor(() => expect(cause(/^Misread/)).toBeChecked());
    expect(screen.getByText(/could not read the question aloud/)).toBeVisible();
    // "Work it": the first wrong line's own cause. 60 − 18 → 58 takes the smaller digit from the
    // larger (Brown & Burton 1978, from memory): a method step.
    await user.click(screen.getByRole('radio', { name: /“Work it”/ }));
    await waitFor(() => expect(cause(/^Method step/)).toBeChecked());
    await user.click(screen.getByRole('radio', { name: /“Write the answer”/ }));
    await waitFor(() => expect(cause(/^Copying/)).toBeChecked());
    await user.click(screen.getByRole('radio', { name: /Not asked yet/ }));
    await waitFor(() => expect(cause(/^Method step/)).toBeChecked());
    // Picked by hand: the stage no longer moves it.
    await user.click(cause(/^Slip/));
    await user.click(screen.getByRole('radio', { name: /“Read it to me”/ }));
    await new Promise((r) => setTimeout(r, 300));
    expect(cause(/^Slip/)).toBeChecked();
  });
});

describe('Edit a miss: word problem', () => {
  async function openEdit(extra: Parameters<typeof mockApi>[0] = {}) {
    const calls = api({
      'GET /misses/21': json(200, wordMiss()),
      'GET /notes?missId=21&pageSize=100': list([]),
      ...extra,
    });
    renderApp('/misses/21');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Edit' }));
    const dialog = await screen.findByRole('dialog');
    return { user, dialog, requests: calls.requests };
  }

  it('shows the saved lines and stage, and sends changed lines and stage for checking', async () => {
    const { user, dialog, requests } = await openEdit({
      'PATCH /misses/21': (request) => json(200, wordMiss(request.body as Record<string, unknown>)),
    });
    const box = within(dialog).getByLabelText('The number sentences the child wrote');
    expect(box).toHaveValue(LINES.join('\n'));
    expect(within(dialog).getByRole('radio', { name: /“Work it”/ })).toBeChecked();
    await user.clear(box);
    await user.type(box, '4 x 15 = 60\n60 - 18 = 42\n\n42 + 7 = 49');
    await user.click(within(dialog).getByRole('radio', { name: /“Read it to me”/ }));
    // The saved cause was the suggestion (a method step), so it follows the new stage.
    await waitFor(() =>
      expect(within(dialog).getByRole('radio', { name: /^Misread/ })).toBeChecked(),
    );
    await user.click(within(dialog).getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText('Saved the changes.')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toMatchObject({
      lines: ['4 x 15 = 60', '60 - 18 = 42', '42 + 7 = 49'],
      stage: 'reading',
      cause: 'reading',
    });
  });

  it('sends neither lines nor stage when they are unchanged, and takes the stage back', async () => {
    const { user, dialog, requests } = await openEdit({
      'PATCH /misses/21': (request) => json(200, wordMiss(request.body as Record<string, unknown>)),
    });
    await user.click(within(dialog).getByRole('radio', { name: /Not asked yet/ }));
    await user.click(within(dialog).getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText('Saved the changes.')).toBeInTheDocument();
    const body = requests.find((r) => r.method === 'PATCH')?.body as Record<string, unknown>;
    expect(body).not.toHaveProperty('lines');
    expect(body.stage).toBeNull();
  });

  it('checks the lines as the log form does, and shows a line the server refused', async () => {
    const { user, dialog, requests } = await openEdit({
      'PATCH /misses/21': json(400, {
        statusCode: 400,
        error: 'Bad Request',
        message: 'Please check lines.1: Line 2 has no “=”',
        fields: { 'lines.1': 'Line 2 has no “=”' },
      }),
    });
    const box = within(dialog).getByLabelText('The number sentences the child wrote');
    await user.clear(box);
    await user.click(box);
    await user.paste(Array.from({ length: 21 }, () => '1 + 1 = 2').join('\n'));
    await user.click(within(dialog).getByRole('button', { name: 'Save changes' }));
    expect(await within(dialog).findByText(/Keep it to 20 number sentences/)).toBeVisible();
    expect(requests.some((r) => r.method === 'PATCH')).toBe(false);

    await user.clear(box);
    await user.type(box, '4 x 15 = 60\n60 - 18');
    await user.click(within(dialog).getByRole('button', { name: 'Save changes' }));
    expect(await within(dialog).findByText('Line 2: Line 2 has no “=”')).toBeVisible();
  });
});

describe('The miss page: word problem', () => {
  it('shows each line right, differing or following, the first that differs marked softly', async () => {
    api({
      'GET /misses/21': json(200, wordMiss()),
      'GET /notes?missId=21&pageSize=100': list([]),
    });
    renderApp('/misses/21');
    const section = await screen.findByRole('region', { name: 'The number sentences' });
    const items = within(section).getAllByRole('listitem');
    expect(items).toHaveLength(3);
    expect(items[0]).toHaveTextContent('4 x 15 = 60');
    expect(items[0]).toHaveTextContent('Right');
    // 60 − 18 = 42 (plain arithmetic).
    expect(items[1]).toHaveTextContent(`Differs: this comes to ${60 - 18}`);
    expect(items[1]).toHaveTextContent('the first line that differs');
    expect(items[1]).toHaveClass('wb-word-line-first');
    expect(items[2]).toHaveTextContent('follows from line 2');
    expect(items[2]).not.toHaveClass('wb-word-line-first');
    expect(within(section).getByText(/Where it went wrong: “Work it”/)).toBeInTheDocument();
  });

  it('shows no such section for a miss without lines', async () => {
    api({
      'GET /misses/21': json(200, wordMiss({ lines: null, linesCheck: null, stage: null })),
      'GET /notes?missId=21&pageSize=100': list([]),
    });
    renderApp('/misses/21');
    await screen.findByRole('heading', { level: 1 });
    expect(screen.queryByRole('region', { name: 'The number sentences' })).toBeNull();
  });
});

describe('The notebook: kind and interview stage', () => {
  it('filters by kind and stage from the address bar, each card naming the kind it matched', async () => {
    // A phone: cards, and the filters folded behind one button.
    vi.spyOn(window, 'matchMedia').mockImplementation(
      (query: string) =>
        ({
          matches: query.includes('max-width'),
          media: query,
          addEventListener: () => undefined,
          removeEventListener: () => undefined,
        }) as unknown as MediaQueryList,
    );
    const { requests } = api({
      'GET /misses?kind=word&stage=process&sort=-occurredOn&page=1&pageSize=25': json(200, {
        items: [{ ...wordMiss(), kind: 'word' }],
        total: 1,
        page: 1,
        pageSize: 25,
      }),
      'GET /misses?kind=money&stage=process&sort=-occurredOn&page=1&pageSize=25': list([]),
    });
    const { router } = renderApp('/notebook?kind=word&stage=process');
    const cards = await screen.findByRole('list', { name: 'Misses' });
    expect(within(cards).getByText('Word problem: doing the arithmetic')).toBeInTheDocument();
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Filters (2 on)' }));
    expect(screen.getByLabelText('Kind of problem')).toHaveValue('word');
    expect(screen.getByLabelText('Word problem went wrong at')).toHaveValue('process');
    expect(
      within(screen.getByLabelText('Kind of problem'))
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual([
      'Any kind',
      'Whole numbers',
      'Fractions',
      'Decimals',
      'Money',
      'Clock times',
      'Word problem',
      'Not read by the checkers',
    ]);
    await user.selectOptions(screen.getByLabelText('Kind of problem'), 'money');
    await waitFor(() => expect(router.state.location.search).toBe('?kind=money&stage=process'));
    await waitFor(() =>
      expect(requests.map((r) => r.path)).toContain(
        '/misses?kind=money&stage=process&sort=-occurredOn&page=1&pageSize=25',
      ),
    );
  });

  it('leaves out a kind or stage the server would refuse', async () => {
    const { requests } = api({
      'GET /misses?sort=-occurredOn&page=1&pageSize=25': list([]),
    });
    renderApp('/notebook?kind=sums&stage=guessing');
    await screen.findByText(/No misses match these filters/);
    expect(requests.filter((r) => r.path.startsWith('/misses?')).map((r) => r.path)).toEqual([
      '/misses?sort=-occurredOn&page=1&pageSize=25',
    ]);
  });
});
