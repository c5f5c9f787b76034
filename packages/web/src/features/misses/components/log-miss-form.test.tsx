import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { diagnose } from '@workback/core';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { fakeUploads } from '../../../testing/fake-xhr';
import { CSRF, json, mockApi, ownerMe, students, tutorMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';
import { today } from '../types';

const list = (items: unknown[]) => json(200, { items, total: items.length });

function savedMiss(id: number, problem: string, answer: string, studentId = 1) {
  const diagnosis = diagnose(problem, answer);
  return {
    id,
    studentId,
    occurredOn: today(),
    sittingId: null,
    keyItemId: null,
    problem,
    answer,
    steps: null,
    explanation: '',
    cause: 'step',
    note: '',
    status: 'logged',
    skills: [],
    revisit: [],
    checked: diagnosis.ok,
    notCheckedReason: null,
    expected: diagnosis.ok ? diagnosis.expected : null,
    correct: diagnosis.ok ? diagnosis.correct : null,
    ruleIds: diagnosis.ok ? diagnosis.rules.map((r) => r.id) : [],
    suggestedCause: null,
    engineVersion: null,
    createdBy: 1,
    updatedBy: 1,
    createdAt: '2026-09-10T10:00:00.000Z',
    updatedAt: '2026-09-10T10:00:00.000Z',
    thumbnailPhotoId: null,
    photoCount: 0,
    diagnosis: diagnosis.ok ? diagnosis : null,
    photos: [],
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

const photo = () => new File([new Uint8Array(2048)], 'sheet.png', { type: 'image/png' });

beforeEach(() => window.localStorage.clear());
afterEach(() => window.localStorage.clear());

async function fillMiss(user: ReturnType<typeof userEvent.setup>, problem: string, answer: string) {
  await user.selectOptions(await screen.findByLabelText('Student'), 'Juniper');
  await user.type(screen.getByLabelText('The problem'), problem);
  await user.type(screen.getByLabelText('The child’s answer'), answer);
}

describe('Log a miss', () => {
  it('reads the problem and diagnoses it while the parent types, suggesting a cause', async () => {
    api();
    renderApp('/misses/new');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('The problem'), '81 - 38');
    expect(await screen.findByText(/\(subtraction\)/)).toBeInTheDocument();
    expect(
      screen.getByText('Type the child’s answer to see where it went differently.'),
    ).toBeVisible();
    await user.type(screen.getByLabelText('The child’s answer'), '57');
    expect(await screen.findByText('Checked: the usual working gives 43.')).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'The usual working' })).toBeInTheDocument();
    const step = screen.getByRole('radio', { name: /Method step/ });
    expect(step).toBeChecked();
    expect(within(step.closest('label') as HTMLElement).getByText('Suggested')).toBeVisible();
    expect(screen.getByText(/not a grade or an assessment of your child/)).toBeInTheDocument();
  });

  it('says when the checkers cannot read the problem, and still lets it be saved', async () => {
    api();
    renderApp('/misses/new');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('The problem'), 'How many legs do 3 cats have?');
    expect(await screen.findByText(/The checkers cannot read this/)).toBeInTheDocument();
    expect(screen.getByText(/You can still save it/)).toBeInTheDocument();
  });

  it('keeps the cause the parent picked when the suggestion changes', async () => {
    api();
    renderApp('/misses/new');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('The problem'), '81 - 38');
    await user.type(screen.getByLabelText('The child’s answer'), '57');
    await screen.findByText('Checked: the usual working gives 43.');
    await user.click(screen.getByRole('radio', { name: /Slip/ }));
    await user.clear(screen.getByLabelText('The child’s answer'));
    await user.type(screen.getByLabelText('The child’s answer'), '44');
    await screen.findByRole('heading', { name: 'One subtraction fact' });
    expect(screen.getByRole('radio', { name: /Slip/ })).toBeChecked();
  });

  it('checks the fields first, naming what is missing under each', async () => {
    const { requests } = api();
    const uploads = fakeUploads({ status: 201, body: savedMiss(5, '1', '1') });
    renderApp('/misses/new');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Save' }));
    expect(await screen.findByText('Choose the child who did this problem.')).toBeVisible();
    expect(screen.getByText('Type the problem as it was written.')).toBeVisible();
    expect(screen.getByText('Type the answer the child wrote.')).toBeVisible();
    expect(uploads.sent).toHaveLength(0);
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('sends the miss and its photo as multipart with the CSRF token, then opens the saved miss', async () => {
    const miss = savedMiss(5, '304 - 75', '139');
    api({
      'GET /misses/5': json(200, miss),
      'GET /notes?missId=5&pageSize=100': list([]),
    });
    const uploads = fakeUploads({ status: 201, body: miss });
    const { router } = renderApp('/misses/new');
    const user = userEvent.setup();
    await fillMiss(user, '304 - 75', '139');
    await user.upload(screen.getByLabelText('Photos of the work'), photo());
    expect(await screen.findByRole('img', { name: 'Photo 1 to send' })).toBeInTheDocument();
    await user.type(screen.getByLabelText('What the child said'), 'The zero stays zero.');
    await screen.findByText('Checked: the usual working gives 229.');
    await user.click(screen.getByRole('button', { name: 'Save' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/misses/5'));
    expect(await screen.findByText('Saved the miss.')).toBeInTheDocument();
    expect(uploads.sent).toHaveLength(1);
    const [sent] = uploads.sent;
    expect(sent?.method).toBe('POST');
    expect(sent?.path).toBe('/misses');
    expect(sent?.headers['x-csrf-token']).toBe('csrf-1');
    expect(sent?.fields).toEqual({
      studentId: '1',
      occurredOn: today(),
      problem: '304 - 75',
      answer: '139',
      explanation: 'The zero stays zero.',
      cause: 'step',
      note: '',
    });
    expect(sent?.files).toEqual([{ field: 'photos', name: 'sheet.png', size: 2048 }]);
    expect(sent?.headers['idempotency-key']).toMatch(/^[0-9a-f]{32}$/);
    expect(window.localStorage.getItem('workback:last-student:10')).toBe('1');
    // The miss opens with its heading focused, so reading starts at its top.
    await waitFor(() => expect(screen.getByRole('heading', { level: 1 })).toHaveFocus());
  });

  it('“Save and log another” keeps the student and the date and clears the rest', async () => {
    api();
    const uploads = fakeUploads({ status: 201, body: savedMiss(6, '58 + 67', '115') });
    const { router } = renderApp('/misses/new');
    const user = userEvent.setup();
    await fillMiss(user, '58 + 67', '115');
    const date = screen.getByLabelText('Date of the work');
    await user.clear(date);
    await user.type(date, '2026-09-08');
    await user.click(screen.getByRole('button', { name: 'Save and log another' }));
    expect(await screen.findByText('Saved. Ready for the next one.')).toBeInTheDocument();
    expect(uploads.sent[0]?.fields.occurredOn).toBe('2026-09-08');
    expect(router.state.location.pathname).toBe('/misses/new');
    expect(screen.getByLabelText('Student')).toHaveValue('1');
    expect(screen.getByLabelText('Date of the work')).toHaveValue('2026-09-08');
    expect(screen.getByLabelText('The problem')).toHaveValue('');
    expect(screen.getByLabelText('The child’s answer')).toHaveValue('');
    expect(screen.getByRole('radio', { name: /Not sure yet/ })).toBeChecked();
    await waitFor(() => expect(screen.getByLabelText('The problem')).toHaveFocus());
  });

  it('keeps everything after a dropped upload and tries again in one tap', async () => {
    const miss = savedMiss(7, '27 x 4', '168');
    api({ 'GET /misses/7': json(200, miss), 'GET /notes?missId=7&pageSize=100': list([]) });
    const uploads = fakeUploads('network-error', { status: 201, body: miss });
    const { router } = renderApp('/misses/new');
    const user = userEvent.setup();
    await fillMiss(user, '27 x 4', '168');
    await user.upload(screen.getByLabelText('Photos of the work'), photo());
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(
      await screen.findByText(/The miss was not saved: Workback could not be reached/),
    ).toBeVisible();
    expect(screen.getByLabelText('The problem')).toHaveValue('27 x 4');
    expect(screen.getByRole('img', { name: 'Photo 1 to send' })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Try again' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/misses/7'));
    expect(uploads.sent).toHaveLength(2);
    expect(uploads.sent[1]?.files).toHaveLength(1);
    // The retry is the same miss: it carries the first try's key, so the server makes one.
    // (No IndexedDB here, so the miss cannot be kept offline and the form offers Try again.)
    const [first, second] = uploads.sent.map((sent) => sent.headers['idempotency-key']);
    expect(first).toMatch(/^[0-9a-f]{32}$/);
    expect(second).toBe(first);
  });

  it('explains a refused photo under the photos and keeps the rest of the form', async () => {
    api();
    fakeUploads({
      status: 415,
      body: {
        statusCode: 415,
        error: 'Unsupported Media Type',
        message: 'Photos must be JPEG, PNG or WebP',
        fields: { photos: 'sheet.png is not a JPEG, PNG or WebP image' },
      },
    });
    renderApp('/misses/new');
    const user = userEvent.setup();
    await fillMiss(user, '27 x 4', '168');
    await user.upload(screen.getByLabelText('Photos of the work'), photo());
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(await screen.findByText('sheet.png is not a JPEG, PNG or WebP image')).toBeVisible();
    expect(screen.queryByRole('button', { name: 'Try again' })).toBeNull();
    expect(screen.getByLabelText('The child’s answer')).toHaveValue('168');
  });

  it('refuses a photo over 10 MiB before sending anything', async () => {
    api();
    const uploads = fakeUploads({ status: 201, body: savedMiss(8, '1 + 1', '3') });
    renderApp('/misses/new');
    const user = userEvent.setup();
    await fillMiss(user, '1 + 1', '3');
    const big = new File([new Uint8Array(10 * 1024 * 1024 + 1)], 'huge.jpg', {
      type: 'image/jpeg',
    });
    await user.upload(screen.getByLabelText('Photos of the work'), big);
    expect(await screen.findByText(/huge\.jpg is over 10 MiB/)).toBeVisible();
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(uploads.sent).toHaveLength(0);
    await user.click(screen.getByRole('button', { name: 'Remove photo 1' }));
    expect(screen.queryByText(/huge\.jpg is over 10 MiB/)).toBeNull();
  });

  it('remembers the student from last time', async () => {
    window.localStorage.setItem('workback:last-student:10', '2');
    api();
    renderApp('/misses/new');
    expect(await screen.findByLabelText('Student')).toHaveValue('2');
  });

  it('tells a tutor that the family logs misses, without a form', async () => {
    mockApi({ 'GET /auth/me': json(200, tutorMe), 'GET /students': list([students[0]]) });
    renderApp('/misses/new');
    expect(await screen.findByText('The family logs the misses')).toBeInTheDocument();
    expect(screen.queryByLabelText('The problem')).toBeNull();
  });

  it('says to add a student first when there are none', async () => {
    api({ 'GET /students': list([]) });
    renderApp('/misses/new');
    expect(
      await screen.findByText('Add a student first, then log the problems they missed.'),
    ).toBeInTheDocument();
  });
});
