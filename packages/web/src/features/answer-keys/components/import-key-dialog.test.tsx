import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { CSRF, json, mockApi, ownerMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

type Sent = { url: string; form: FormData };

/** The API client uploads through XMLHttpRequest (for progress); this fake answers in its place. */
function fakeUploads(reply: (sent: Sent) => { status: number; body: unknown }) {
  const sent: Sent[] = [];
  class FakeXhr {
    status = 0;
    statusText = '';
    responseText = '';
    upload = { addEventListener: () => undefined };
    private url = '';
    private listeners: Record<string, (() => void)[]> = {};
    open(_method: string, url: string) {
      this.url = url;
    }
    setRequestHeader() {}
    addEventListener(type: string, listener: () => void) {
      (this.listeners[type] ??= []).push(listener);
    }
    send(form: FormData) {
      const request = { url: this.url, form };
      sent.push(request);
      const { status, body } = reply(request);
      setTimeout(() => {
        this.status = status;
        this.responseText = JSON.stringify(body);
        for (const listener of this.listeners.load ?? []) listener();
      }, 0);
    }
  }
  vi.stubGlobal('XMLHttpRequest', FakeXhr);
  return sent;
}

const GOOD_CSV = [
  'number,prompt,answer,skills,revisit,facts',
  '1,58 + 67,125,addition; regrouping,3,',
  '2,47 x 24,"1,138",multiplication,10-11,',
  '3,"Nell has 3 bags of 8 shells, then finds 5 more. How many shells?",29,word problems,9; 14,eights',
].join('\r\n');

const csvFile = (text: string, name = 'worksheet-14.csv') =>
  new File([text], name, { type: 'text/csv' });

const importedKey = {
  id: 9,
  title: 'Worksheet 14',
  kind: 'worksheet',
  courseId: null,
  lessonNumber: null,
  itemCount: 3,
  sittingCount: 0,
  createdAt: '2026-09-01T10:00:00.000Z',
  updatedAt: '2026-09-01T10:00:00.000Z',
  items: [],
  flags: [],
  corrections: [],
};

beforeEach(() => {
  mockApi({
    ...CSRF,
    'GET /auth/me': json(200, ownerMe),
    'GET /answer-keys': json(200, { items: [], total: 0 }),
    'GET /courses': json(200, {
      items: [{ id: 2, name: 'Number Trail', level: null, lessonCount: 20 }],
      total: 1,
    }),
    'GET /answer-keys/9': json(200, importedKey),
  });
});

afterEach(() => {
  vi.unstubAllGlobals();
});

async function openImport() {
  renderApp('/keys');
  const user = userEvent.setup();
  await user.click(await screen.findByRole('button', { name: 'Import a CSV' }));
  const dialog = await screen.findByRole('dialog', { name: 'Import a key from a CSV file' });
  return { user, dialog };
}

describe('importing a key from CSV', () => {
  it('previews every row in the browser, with the checker’s flags, before uploading', async () => {
    const sent = fakeUploads(() => ({ status: 201, body: importedKey }));
    const { user, dialog } = await openImport();
    await user.upload(within(dialog).getByLabelText('CSV file'), csvFile(GOOD_CSV));

    expect(
      await within(dialog).findByText('3 items read from worksheet-14.csv.'),
    ).toBeInTheDocument();
    expect(within(dialog).getByLabelText('Title')).toHaveValue('Worksheet 14');
    const rows = within(
      within(dialog).getByRole('table', { name: 'Items read from the file' }),
    ).getAllByRole('row');
    expect(rows).toHaveLength(4);
    expect(rows[1]).toHaveTextContent('58 + 67');
    expect(rows[1]).toHaveTextContent('Checker agrees');
    expect(rows[2]).toHaveTextContent(/The key says 1,138, but 47 × 24 = 1,128 — please check\./);
    expect(rows[3]).toHaveTextContent('Not checked');
    expect(sent).toHaveLength(0);

    await user.selectOptions(within(dialog).getByLabelText('Kind'), 'worksheet');
    await user.click(within(dialog).getByRole('button', { name: 'Import 3 items' }));
    expect(await screen.findByText('Imported Worksheet 14: 3 items.')).toBeInTheDocument();
    expect(sent).toHaveLength(1);
    expect(sent[0]?.url).toBe('/api/answer-keys/import');
    expect(sent[0]?.form.get('title')).toBe('Worksheet 14');
    expect(sent[0]?.form.get('kind')).toBe('worksheet');
    expect(sent[0]?.form.get('courseId')).toBeNull();
    expect((sent[0]?.form.get('file') as File).name).toBe('worksheet-14.csv');
  });

  it('lists the rows it cannot read and does not upload them', async () => {
    const sent = fakeUploads(() => ({ status: 201, body: importedKey }));
    const { user, dialog } = await openImport();
    const bad = [
      'number,prompt,answer,revisit',
      '1,58 + 67,,3',
      '2,81 - 38,43,7-5',
      '3,"1,300 - 522",778',
    ].join('\n');
    await user.upload(within(dialog).getByLabelText('CSV file'), csvFile(bad));

    const list = await within(dialog).findByRole('list', { name: 'Problems in the file' });
    expect(
      within(list)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual([
      'Line 2, answer: answer is missing (1 to 80 characters)',
      'Line 3, lessons to revisit: range “7-5” runs backwards; write 5-7',
      'Line 4, columns: has 3 values; the header has 4 (put a cell holding a comma in double quotes)',
    ]);
    expect(within(dialog).getByRole('button', { name: 'Import 2 items' })).toBeDisabled();
    expect(sent).toHaveLength(0);
  });

  it('shows the API’s refusal by line and field when the file reads well but cannot be imported', async () => {
    fakeUploads(() => ({
      status: 400,
      body: {
        statusCode: 400,
        error: 'Bad Request',
        message: '2 rows have problems; nothing was imported.',
        fields: {
          'line 3.revisit': 'lessons 10, 11 are not in “Number Trail”',
          'line 4.revisit': 'lesson 14 is not in “Number Trail”',
        },
      },
    }));
    const { user, dialog } = await openImport();
    await user.upload(within(dialog).getByLabelText('CSV file'), csvFile(GOOD_CSV));
    await within(dialog).findByText('3 items read from worksheet-14.csv.');
    await user.selectOptions(within(dialog).getByLabelText('Kind'), 'review');
    await user.selectOptions(within(dialog).getByLabelText('Course (optional)'), '2');
    await user.click(within(dialog).getByRole('button', { name: 'Import 3 items' }));

    const refusal = (await within(dialog).findByText('Nothing was imported')).closest(
      '[role="alert"]',
    ) as HTMLElement;
    expect(
      within(refusal)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual([
      'Line 3, lessons to revisit: lessons 10, 11 are not in “Number Trail”',
      'Line 4, lessons to revisit: lesson 14 is not in “Number Trail”',
    ]);
    expect(screen.getByRole('dialog')).toBeInTheDocument();
  });

  it('asks for the kind and the file under their fields', async () => {
    const sent = fakeUploads(() => ({ status: 201, body: importedKey }));
    const { user, dialog } = await openImport();
    await user.click(within(dialog).getByRole('button', { name: 'Import' }));
    expect(
      await within(dialog).findByText('Choose worksheet, review or assessment.'),
    ).toBeInTheDocument();
    expect(within(dialog).getByText('Give the key a title.')).toBeInTheDocument();
    await user.type(within(dialog).getByLabelText('Title'), 'Review 2');
    await user.selectOptions(within(dialog).getByLabelText('Kind'), 'review');
    await user.click(within(dialog).getByRole('button', { name: 'Import' }));
    await waitFor(() =>
      expect(within(dialog).getByText('Choose the CSV file first.')).toBeInTheDocument(),
    );
    expect(sent).toHaveLength(0);
  });
});
