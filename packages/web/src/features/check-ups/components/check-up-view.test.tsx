import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, students, tutorMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';
import type { CheckUp } from '../types';

const checkUp: CheckUp = {
  id: 7,
  studentId: 1,
  answerKeyId: 30,
  sittingId: null,
  ruleIds: ['sub.borrow-across-zero', 'sub.borrow-from-zero'],
  operation: 'subtraction',
  hypotheses: [
    { id: 'correct', name: 'The usual working (the miss was a one-off slip)' },
    { id: 'sub.borrow-across-zero', name: 'Zeros skipped when regrouping' },
    { id: 'sub.borrow-from-zero', name: 'Zero changed to 9, regrouping stopped' },
  ],
  problems: [
    {
      problem: '5003 − 468',
      answers: {
        correct: '4535',
        'sub.borrow-across-zero': '3635',
        'sub.borrow-from-zero': '5535',
      },
    },
    {
      problem: '3900 − 131',
      answers: {
        correct: '3769',
        'sub.borrow-across-zero': '3679',
        'sub.borrow-from-zero': '3869',
      },
    },
  ],
  merged: [],
  status: 'not taken',
  reading: null,
  createdAt: '2026-11-20T10:00:00.000Z',
};

const taken: CheckUp = {
  ...checkUp,
  sittingId: 55,
  status: 'confirmed',
  reading: {
    verdict: 'confirmed',
    confirmed: 'sub.borrow-across-zero',
    ruledOut: ['correct', 'sub.borrow-from-zero'],
    open: ['sub.borrow-across-zero'],
    scores: [],
    sentence: 'The answers fit “Zeros skipped when regrouping” and none of the other explanations.',
    answers: ['3635', '3679'],
  },
};

describe('the check-up page', () => {
  it('lists what it tells apart and takes the child’s answers in a quick grid', async () => {
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /students': json(200, { items: students, total: 2 }),
      'GET /check-ups/7': json(200, checkUp),
      'POST /check-ups/7/answers': json(201, taken),
    });
    renderApp('/check-ups/7');
    expect(
      await screen.findByRole('heading', { name: /Check-up for Juniper/ }),
    ).toBeInTheDocument();
    expect(screen.getByText('Zeros skipped when regrouping')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Sheet for Juniper (PDF)' })).toBeInTheDocument();

    const user = userEvent.setup();
    await user.type(screen.getByLabelText('1. 5003 − 468'), '3635');
    await user.type(screen.getByLabelText('2. 3900 − 131'), '3679');
    await user.click(screen.getByRole('button', { name: 'Save the answers' }));

    const reading = await screen.findByRole('region', { name: 'What the answers say' });
    expect(reading).toHaveTextContent('Fits: Zeros skipped when regrouping');
    expect(reading).toHaveTextContent('Ruled out: The usual working');
    const sent = requests.find((r) => r.path === '/check-ups/7/answers');
    expect(sent?.body).toMatchObject({ answers: ['3635', '3679'] });
    const rows = within(reading).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('3635');
  });

  it('lets a tutor read it, but leaves the answers to a parent', async () => {
    mockApi({
      'GET /auth/me': json(200, tutorMe),
      'GET /students': json(200, { items: students, total: 2 }),
      'GET /check-ups/7': json(200, checkUp),
    });
    renderApp('/check-ups/7');
    expect(
      await screen.findByText('A parent enters the answers once the check-up is done.'),
    ).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save the answers' })).not.toBeInTheDocument();
  });
});
