import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, students, tutorMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const item = (id: number, number: number, prompt: string, answer: string) => ({
  id,
  number,
  prompt,
  answer,
  skills: [],
  revisit: ['12'],
  revisitLessons: [12],
  facts: [],
  check: { status: 'agrees', expected: answer },
});

const baseKey = {
  id: 4,
  title: 'Review 2',
  kind: 'review',
  courseId: null,
  lessonNumber: null,
  itemCount: 2,
  sittingCount: 1,
  createdAt: '2026-09-01T10:00:00.000Z',
  updatedAt: '2026-09-01T10:00:00.000Z',
  items: [item(41, 1, '81 - 38', '43'), item(42, 2, '47 x 24', '1,128')],
  flags: [],
  corrections: [],
};

function setup(me = ownerMe, key: object = baseKey) {
  const api = mockApi({
    ...CSRF,
    'GET /auth/me': json(200, me),
    'GET /courses': json(200, { items: [], total: 0 }),
    'GET /students': json(200, { items: students, total: 2 }),
    'GET /answer-keys/4': json(200, key),
  });
  renderApp('/keys/4');
  return { ...api, user: userEvent.setup() };
}

describe('the key editor', () => {
  it('flags an answer the checker disagrees with, next to the item, while typing', async () => {
    const { user } = setup();
    const answer = await screen.findByRole('textbox', { name: 'Answer, item 2' });
    expect(screen.queryByText(/please check/)).toBeNull();
    await user.clear(answer);
    await user.type(answer, '1,138');
    const flag = screen.getByText(
      'Item 2: The key says 1,138, but 47 × 24 = 1,128 — please check.',
    );
    expect(answer).toHaveAttribute('aria-describedby', flag.id);
    await user.clear(answer);
    await user.type(answer, '1128');
    expect(screen.queryByText(/please check/)).toBeNull();
  });

  it('adds the next item with Enter on the last row, numbered after the others', async () => {
    const { user } = setup();
    const facts = await screen.findByRole('textbox', { name: 'Fact family, item 2' });
    await user.click(facts);
    await user.keyboard('{Enter}');
    expect(screen.getByRole('textbox', { name: 'No., item 3' })).toHaveValue('3');
    expect(screen.getByRole('textbox', { name: 'Problem, item 3' })).toHaveFocus();
    // Enter on an earlier row moves down instead.
    await user.click(screen.getByRole('textbox', { name: 'Problem, item 1' }));
    await user.keyboard('{Enter}');
    expect(screen.getByRole('textbox', { name: 'Problem, item 2' })).toHaveFocus();
    expect(screen.getAllByRole('textbox', { name: /^No\., item/ })).toHaveLength(3);
  });

  it('asks why a key with sittings changed, then says which sittings were re-marked', async () => {
    const { user, requests } = setup();
    const answer = await screen.findByRole('textbox', { name: 'Answer, item 1' });
    await user.clear(answer);
    await user.type(answer, '53');
    await user.click(screen.getByRole('button', { name: 'Save the key' }));
    expect(
      await screen.findByText('Say why, e.g. “the printed key had a typo in item 4”.'),
    ).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'PATCH')).toBe(false);

    const saved = {
      ...baseKey,
      items: [item(41, 1, '81 - 38', '53'), baseKey.items[1]],
      corrections: [
        {
          id: 7,
          itemId: 41,
          itemNumber: 1,
          changes: { answer: { from: '43', to: '53' } },
          reason: 'The printed key had a typo',
          madeBy: { userId: 1, name: 'Sam' },
          createdAt: '2026-09-09T10:00:00.000Z',
          remarkedSittingIds: [5],
        },
      ],
      newCorrections: [],
      remarkedSittings: [
        {
          sittingId: 5,
          studentId: 1,
          before: { correct: 1, marked: 2 },
          after: { correct: 2, marked: 2 },
          itemIds: [41],
          resolvedMissIds: [30],
          newMissIds: [],
        },
      ],
    };
    mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /courses': json(200, { items: [], total: 0 }),
      'GET /students': json(200, { items: students, total: 2 }),
      'GET /answer-keys/4': json(200, saved),
      'PATCH /answer-keys/4': (request) => {
        expect(request.body).toMatchObject({
          reason: 'The printed key had a typo',
          items: [
            { id: 41, number: 1, prompt: '81 - 38', answer: '53', revisit: ['12'] },
            { id: 42, number: 2, prompt: '47 x 24', answer: '1,128' },
          ],
        });
        return json(200, saved);
      },
    });
    await user.type(screen.getByLabelText('Why did the key change?'), 'The printed key had a typo');
    await user.click(screen.getByRole('button', { name: 'Save the key' }));

    const callout = await screen.findByText('The correction re-marked 1 sitting');
    const box = callout.closest('[role="status"]') as HTMLElement;
    expect(box).toHaveTextContent(
      'Juniper’s sitting: 1 → 2 right of 2; 1 miss resolved (no longer wrong)',
    );
    expect(within(box).getByRole('link', { name: 'Juniper’s sitting' })).toHaveAttribute(
      'href',
      '/sittings/5',
    );
    const history = screen.getByRole('list', { name: 'Corrections' });
    expect(history).toHaveTextContent('Item 1 — answer: 43 → 53');
    expect(history).toHaveTextContent('“The printed key had a typo”');
    expect(history).toHaveTextContent(/Sam, .* · re-marked 1 sitting/);
  });

  it('shows a tutor the items and the checker’s flags without inputs', async () => {
    setup(tutorMe, {
      ...baseKey,
      items: [
        baseKey.items[0],
        {
          ...item(42, 2, '47 x 24', '1,138'),
          check: {
            status: 'disagrees',
            expected: '1128',
            message: 'item 2: the key says 1,138, but 47 × 24 = 1,128 — please check',
          },
        },
      ],
    });
    expect(
      await screen.findByText('item 2: the key says 1,138, but 47 × 24 = 1,128 — please check'),
    ).toBeInTheDocument();
    expect(screen.queryByRole('textbox')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Delete key' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Export CSV' })).toHaveAttribute(
      'href',
      '/api/answer-keys/4/export.csv',
    );
  });
});
