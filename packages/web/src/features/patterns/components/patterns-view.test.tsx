import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, students, tutorMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';
import { localDay } from '../period';

const list = (items: unknown[]) => json(200, { items, total: items.length });
const zeros = () => Array.from({ length: 11 }, () => Array.from({ length: 11 }, () => 0));

function patternsFor(studentId: number, from: string) {
  const multiplication = zeros();
  multiplication[7]![8] = 3;
  multiplication[8]![7] = 3;
  return {
    studentId,
    from,
    to: null,
    missCount: 6,
    rightItemCount: 20,
    caution:
      'These are patterns across the work, to help you decide what to review; they do not grade your child.',
    causeMix: [
      {
        week: '2026-W10',
        from: '2026-03-02',
        to: '2026-03-08',
        total: 4,
        causes: { slip: 0, fact: 1, concept: 0, step: 3, reading: 0, copying: 0, unsure: 0 },
      },
    ],
    rules: [
      {
        ruleId: 'sub.borrow-across-zero',
        title: 'Borrowing across a zero',
        kind: 'systematic',
        count: 4,
        firstSeen: '2026-03-02',
        lastSeen: '2026-03-20',
        missIds: [11, 12, 13, 14],
      },
    ],
    skills: [],
    facts: {
      addition: zeros(),
      multiplication,
      list: [
        {
          op: 'x',
          a: 7,
          b: 8,
          expected: 56,
          text: '7 × 8',
          written: [54, 54, 58],
          families: ['x7', 'x8'],
          count: 3,
          firstSeen: '2026-03-03',
          lastSeen: '2026-03-19',
          missIds: [21, 22, 23],
        },
      ],
      families: [],
    },
    recurring: [
      {
        key: 'rule:sub.borrow-across-zero',
        kind: 'rule',
        id: 'sub.borrow-across-zero',
        label: 'Borrowing across a zero',
        count: 4,
        firstSeen: '2026-03-02',
        lastSeen: '2026-03-20',
        missIds: [11, 12, 13, 14],
        window: { from: '2026-03-02', to: '2026-03-31', count: 4 },
        status: 'not-reviewed',
        sincePlan: null,
        sentence: 'Juniper keeps borrowing across zeros: seen 4 times in 3 weeks.',
        notes: [
          {
            id: 1,
            studentId,
            patternKey: 'rule:sub.borrow-across-zero',
            body: 'Tried base-ten blocks.',
            author: { id: 2, displayName: 'Kit' },
            createdAt: '2026-03-21T10:00:00.000Z',
          },
        ],
      },
      {
        key: 'fact:x7',
        kind: 'fact',
        id: 'x7',
        label: 'The ×7 facts',
        count: 3,
        firstSeen: '2026-03-03',
        lastSeen: '2026-03-19',
        missIds: [21, 22, 23],
        window: { from: '2026-03-03', to: '2026-04-01', count: 3 },
        status: 'faded',
        sincePlan: { planId: 5, scheduledFor: '2026-03-10', seenAgain: 0, lastSeen: null },
        sentence: 'Juniper keeps missing ×7 facts: seen 3 times in 3 weeks.',
        notes: [],
      },
    ],
    findings: {
      rules: [
        {
          ruleId: 'sub.borrow-across-zero',
          title: 'Borrowing across a zero',
          status: 'finding',
          explains: 4,
          inPairs: 0,
          evidence: [{ missId: 11, occurredOn: '2026-03-02', problem: '304 - 75', answer: '139' }],
          contradictions: [],
          score: 4,
          group: 'zero-regrouping',
        },
      ],
      groups: [],
    },
    notes: [],
  };
}

function twelveWeeksAgo() {
  const today = new Date();
  return localDay(new Date(today.getFullYear(), today.getMonth(), today.getDate() - 83));
}

describe('Patterns page', () => {
  it('leads with what keeps coming back, linked to the notebook filtered to those misses', async () => {
    const from = twelveWeeksAgo();
    const { requests } = mockApi({
      'GET /auth/me': json(200, tutorMe),
      'GET /students': list([students[0]]),
      [`GET /patterns?studentId=1&from=${from}`]: json(200, patternsFor(1, from)),
    });
    renderApp('/patterns');
    const recurring = await screen.findByRole('list', { name: 'Recurring patterns' });
    const cards = Array.from(recurring.children) as HTMLElement[];
    expect(cards[0]).toHaveTextContent(
      'Juniper keeps making the same step error, “Borrowing across a zero”: seen 4 times in 3 weeks; no review plan has covered it yet.',
    );
    expect(within(cards[0]!).getByText('Not on a review plan yet')).toBeInTheDocument();
    expect(
      within(cards[0]!).getByRole('link', { name: 'See the 4 misses in the notebook' }),
    ).toHaveAttribute('href', `/notebook?student=1&rule=sub.borrow-across-zero&from=${from}`);
    expect(within(cards[0]!).getByText('Tried base-ten blocks.')).toBeInTheDocument();
    // A fact pattern has no notebook filter: each miss is linked on its own.
    expect(within(cards[1]!).getByText('Faded since the review')).toBeInTheDocument();
    expect(cards[1]).toHaveTextContent(
      /Juniper keeps missing The ×7 facts: seen 3 times in 3 weeks; not seen since the review on/,
    );
    expect(cards[1]).toHaveTextContent(
      /Juniper keeps missing The ×7 facts: seen 3 times in 3 weeks; not seen since the review on/,
    );
    expect(within(cards[1]!).getByRole('link', { name: 'Miss 2 of 3' })).toHaveAttribute(
      'href',
      '/misses/22',
    );
    expect(screen.getAllByText(/do not grade your child/)).toHaveLength(2);
    expect(requests.some((r) => r.path.startsWith('/patterns?studentId=1'))).toBe(true);
  });

  it('shows the fact-gap grid with numbers, and a cell opens its misses', async () => {
    const from = twelveWeeksAgo();
    mockApi({
      'GET /auth/me': json(200, tutorMe),
      'GET /students': list([students[0]]),
      [`GET /patterns?studentId=1&from=${from}`]: json(200, patternsFor(1, from)),
    });
    const user = userEvent.setup();
    renderApp('/patterns');
    const cell = await screen.findByRole('button', { name: '3 wrong: 7 × 8' });
    expect(cell).toHaveTextContent('3');
    expect(screen.getByRole('button', { name: '3 wrong: 8 × 7' })).toBeInTheDocument();
    await user.click(cell);
    const detail = await screen.findByRole('list', { name: 'The misses of this fact' });
    expect(detail).toHaveTextContent('7 × 8 = 56 wrong 3 times (written 54, 54, 58)');
    expect(within(detail).getByRole('link', { name: 'Open miss 1 of 7 × 8' })).toHaveAttribute(
      'href',
      '/misses/21',
    );
  });

  it('lets a tutor add a note on a pattern', async () => {
    const from = twelveWeeksAgo();
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': json(200, tutorMe),
      'GET /students': list([students[0]]),
      [`GET /patterns?studentId=1&from=${from}`]: json(200, patternsFor(1, from)),
      'POST /patterns/notes': json(201, { id: 9 }),
    });
    const user = userEvent.setup();
    renderApp('/patterns');
    await user.click(await screen.findByRole('button', { name: 'Add a note on The ×7 facts' }));
    await user.click(screen.getByRole('button', { name: 'Save note' }));
    expect(await screen.findByText('Write the note first.')).toBeInTheDocument();
    await user.type(screen.getByLabelText('Your note'), 'Skip counting by 7 went well.');
    await user.click(screen.getByRole('button', { name: 'Save note' }));
    await waitFor(() =>
      expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
        studentId: 1,
        patternKey: 'fact:x7',
        body: 'Skip counting by 7 went well.',
      }),
    );
    // The patterns are asked for again, so the new note shows.
    await waitFor(() =>
      expect(requests.filter((r) => r.path.startsWith('/patterns?')).length).toBe(2),
    );
  });

  it('says what to do first when the period has no misses', async () => {
    const from = twelveWeeksAgo();
    mockApi({
      'GET /auth/me': json(200, tutorMe),
      'GET /students': list([students[0]]),
      [`GET /patterns?studentId=1&from=${from}`]: json(200, {
        ...patternsFor(1, from),
        missCount: 0,
      }),
    });
    renderApp('/patterns');
    expect(
      await screen.findByText(/No misses logged for Juniper in this period/),
    ).toBeInTheDocument();
  });
});
