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
      'These are patterns across the work, to help decide what to review; they do not grade the child.',
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
    difficulties: [
      {
        key: 'group:zero-regrouping',
        kind: 'method',
        title: 'Regrouping across zeros',
        status: 'finding',
        sentence:
          'Finding: “Zeros skipped when regrouping” reproduces 4 answers exactly, and no answer the child got right goes against it. 4 misses in all.',
        // Two rules of the family and two skills: its link lists the family's misses.
        ruleIds: ['sub.borrow-across-zero', 'sub.borrow-from-zero'],
        skills: ['regrouping across zeros', 'subtraction'],
        patternKeys: ['rule:sub.borrow-across-zero', 'skill:regrouping across zeros'],
        count: 5,
        evidence: [
          { missId: 15, occurredOn: '2026-03-24', problem: '700 - 24', answer: '776' },
          { missId: 14, occurredOn: '2026-03-20', problem: '4006 - 989', answer: '3127' },
          { missId: 13, occurredOn: '2026-03-12', problem: '1300 - 522', answer: '878' },
          { missId: 12, occurredOn: '2026-03-05', problem: '605 - 48', answer: '467' },
          { missId: 11, occurredOn: '2026-03-02', problem: '304 - 75', answer: '139' },
        ],
        recurring: {
          key: 'rule:sub.borrow-across-zero',
          kind: 'rule',
          id: 'sub.borrow-across-zero',
          label: 'Zeros skipped when regrouping',
          count: 4,
          firstSeen: '2026-03-02',
          lastSeen: '2026-03-20',
          missIds: [11, 12, 13, 14],
          window: { from: '2026-03-02', to: '2026-03-31', count: 4 },
          status: 'not-reviewed',
          sincePlan: null,
          sentence: '',
        },
        contradictions: [],
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
        title: '× and ÷ facts with 7',
        status: 'recurring',
        sentence: '3 misses with a wrong fact in this family.',
        ruleIds: [],
        skills: [],
        patternKeys: ['fact:x7'],
        count: 3,
        evidence: [
          { missId: 23, occurredOn: '2026-03-19', problem: '7 x 8', answer: '58' },
          { missId: 22, occurredOn: '2026-03-10', problem: '7 x 8', answer: '54' },
          { missId: 21, occurredOn: '2026-03-03', problem: '7 x 8', answer: '54' },
        ],
        recurring: {
          key: 'fact:x7',
          kind: 'fact',
          id: 'x7',
          label: '× and ÷ facts with 7',
          count: 3,
          firstSeen: '2026-03-03',
          lastSeen: '2026-03-19',
          missIds: [21, 22, 23],
          window: { from: '2026-03-03', to: '2026-04-01', count: 3 },
          status: 'faded',
          sincePlan: { planId: 5, scheduledFor: '2026-03-10', seenAgain: 0, lastSeen: null },
          sentence: '',
        },
        contradictions: [],
        notes: [],
      },
      {
        key: 'rule:add.no-carry',
        kind: 'method',
        title: 'Carry dropped (addition)',
        status: 'possible',
        sentence: '1 miss could come from this method; not enough to call it a finding.',
        ruleIds: ['add.no-carry'],
        skills: ['adding with regrouping'],
        patternKeys: ['rule:add.no-carry'],
        count: 1,
        evidence: [{ missId: 31, occurredOn: '2026-03-18', problem: '58 + 67', answer: '115' }],
        recurring: null,
        contradictions: [],
        notes: [],
      },
    ],
    notes: [],
  };
}

function twelveWeeksAgo() {
  const today = new Date();
  return localDay(new Date(today.getFullYear(), today.getMonth(), today.getDate() - 83));
}

describe('Patterns page', () => {
  it('gives one card per difficulty, its problems listed, findings as the page defines them', async () => {
    const from = twelveWeeksAgo();
    const { requests } = mockApi({
      'GET /auth/me': json(200, tutorMe),
      'GET /students': list([students[0]]),
      [`GET /patterns?studentId=1&from=${from}`]: json(200, patternsFor(1, from)),
    });
    renderApp('/patterns');
    const cards = Array.from(
      (await screen.findByRole('list', { name: 'Difficulties' })).children,
    ) as HTMLElement[];
    // The rule, its skill and its family group are one card.
    expect(cards).toHaveLength(2);
    expect(
      within(cards[0]!).getByRole('heading', { name: 'Regrouping across zeros' }),
    ).toBeInTheDocument();
    expect(within(cards[0]!).getByText('Finding')).toBeInTheDocument();
    expect(cards[0]).toHaveTextContent('Skills: regrouping across zeros, subtraction');
    expect(cards[0]).toHaveTextContent(
      'Juniper keeps making the same step error, “Zeros skipped when regrouping”: seen 4 times in 3 weeks; no review plan has covered it yet.',
    );
    // Evidence is the problems themselves: problem · child's answer · date, a few, then the notebook.
    const problems = within(cards[0]!).getByRole('list', {
      name: 'The problems: Regrouping across zeros',
    });
    expect(problems.children[0]).toHaveTextContent(/^700 - 24 · wrote 776 · (24 Mar|Mar 24)/);
    expect(within(problems).queryByRole('link', { name: '304 - 75' })).not.toBeInTheDocument();
    expect(
      within(cards[0]!).getByRole('link', { name: 'See all 5 in the notebook' }),
    ).toHaveAttribute('href', `/notebook?student=1&rule=group%3Azero-regrouping&from=${from}`);
    expect(within(cards[0]!).queryByText(/and \d+ more/)).not.toBeInTheDocument();
    expect(within(cards[0]!).getByText('Tried base-ten blocks.')).toBeInTheDocument();
    // A recurring fact family is not called a finding.
    expect(within(cards[1]!).getByText('Keeps coming back')).toBeInTheDocument();
    expect(within(cards[1]!).queryByText('Finding')).not.toBeInTheDocument();
    expect(within(cards[1]!).getByText('Faded since the review')).toBeInTheDocument();
    expect(within(cards[1]!).getAllByRole('link', { name: '7 x 8' })).toHaveLength(3);
    // Seen once: folded away as possible, with its unique rule name.
    expect(screen.getByText(/Seen only once or twice \(1 difficulty\)/)).toBeInTheDocument();
    expect(
      screen.getByRole('heading', { name: 'Carry dropped (addition)', hidden: true }),
    ).toBeInTheDocument();
    // Words for a tutor too: nothing says "your child".
    expect(screen.queryByText(/your child/i)).not.toBeInTheDocument();
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
    await user.click(
      await screen.findByRole('button', { name: 'Add a note on × and ÷ facts with 7' }),
    );
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
