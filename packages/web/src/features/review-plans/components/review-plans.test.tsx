import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { diagnose } from '@workback/core';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe, students, tutorMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const list = (items: unknown[]) =>
  json(200, { items, total: items.length, page: 1, pageSize: 100 });
const miss = (id: number, occurredOn: string, problem: string, answer: string, status: string) => ({
  id,
  studentId: 1,
  occurredOn,
  problem,
  answer,
  cause: 'step',
  status,
  ruleIds: ['sub.borrow-across-zero'],
});

const plan = {
  id: 5,
  studentId: 1,
  scheduledFor: '2026-03-12',
  status: 'open',
  lessonsText: 'Lessons 12–14',
  createdBy: 1,
  createdAt: '2026-03-10T10:00:00.000Z',
  updatedAt: '2026-03-10T10:00:00.000Z',
  progress: { done: 0, total: 2 },
  student: { id: 1, name: 'Juniper', gradeLevel: '4' },
  lessons: { text: 'Lessons 12–14', ranges: [] },
  factFamilies: [],
  practice: [],
  misses: [],
  covers: [],
  notes: [],
  summary: {
    lessons: [
      'Revisit lessons 12–14: 12 “Taking away across a zero”, 13 “Two zeros”, 14 “Checking”',
    ],
    facts: ['× and ÷ facts with 8: 7 × 8'],
    focus: [
      {
        missId: 41,
        problem: '304 - 75',
        answer: '139',
        expected: '229',
        occurredOn: '2026-03-09',
        recurs: 1,
        reason: 'Seen once on this plan: regrouping across zeros.',
      },
    ],
  },
  warning: null,
  items: [
    {
      id: 31,
      position: 0,
      kind: 'lesson',
      key: 'lesson:12-14',
      title: 'Lessons 12–14',
      payload: { from: 12, to: 14, label: 'Lessons 12–14', missIds: [41] },
      done: false,
      doneAt: null,
      doneBy: null,
      missIds: [41],
    },
    {
      id: 32,
      position: 1,
      kind: 'miss',
      key: 'miss:41',
      title: '304 - 75',
      payload: { missId: 41, problem: '304 - 75', answer: '139', occurredOn: '2026-03-09' },
      done: false,
      doneAt: null,
      doneBy: null,
      missIds: [41],
    },
  ],
};

describe('review plans', () => {
  it('builds a plan from every open miss by default, warning when it is the day of the work', async () => {
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /students': list([students[0]]),
      'GET /misses?studentId=1&status=logged&pageSize=100&sort=-occurredOn': list([
        miss(41, '2026-03-09', '304 - 75', '139', 'logged'),
      ]),
      'GET /misses?studentId=1&status=discussed&pageSize=100&sort=-occurredOn': list([
        miss(42, '2026-03-05', '500 - 38', '572', 'discussed'),
      ]),
      'POST /review-plans': json(201, plan),
      'GET /review-plans/5': json(200, plan),
    });
    const user = userEvent.setup();
    renderApp('/review-plans/new?student=1');
    expect(await screen.findByText('Misses to review (2 of 2 ticked)')).toBeInTheDocument();
    const day = screen.getByLabelText('Day of the review');
    await user.clear(day);
    await user.type(day, '2026-03-09');
    expect(await screen.findByText('Same day as the sitting it reviews')).toBeInTheDocument();
    await user.click(screen.getByRole('checkbox', { name: /304 - 75/ }));
    expect(screen.queryByText('Same day as the sitting it reviews')).not.toBeInTheDocument();
    expect(screen.getByText('Misses to review (1 of 2 ticked)')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Build the plan' }));
    await screen.findByRole('heading', { name: 'Review plan for Juniper' });
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      studentId: 1,
      scheduledFor: '2026-03-09',
      missIds: [42],
    });
  });

  it('checks an item off and e-mails the plan to the chosen members', async () => {
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /review-plans/5': json(200, plan),
      'PATCH /review-plans/5': json(200, {
        ...plan,
        progress: { done: 1, total: 2 },
        items: [{ ...plan.items[0], done: true }, plan.items[1]],
      }),
      'GET /members': list([
        { id: 1, displayName: 'Sam', email: 'sam@example.test', role: 'owner', isYou: true },
        { id: 2, displayName: 'Kit', email: 'kit@example.test', role: 'tutor', isYou: false },
      ]),
      'POST /review-plans/5/send': json(200, { sent: [{ memberId: 2, displayName: 'Kit' }] }),
    });
    const user = userEvent.setup();
    renderApp('/review-plans/5');
    expect(await screen.findByText('Re-work 304 - 75')).toBeInTheDocument();
    // The summary comes first: lessons by title, facts, and the problems most worth re-working.
    const start = screen.getByRole('region', { name: 'Start here' });
    expect(
      within(start).getByText(/Lessons 12–14: 12 “Taking away across a zero”/),
    ).toBeInTheDocument();
    expect(within(start).getByText('× and ÷ facts with 8: 7 × 8')).toBeInTheDocument();
    expect(
      within(start).getByText('Seen once on this plan: regrouping across zeros.'),
    ).toBeInTheDocument();
    await user.click(screen.getByRole('checkbox', { name: 'Lessons 12–14' }));
    expect(await screen.findByText('1 of 2 done')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({
      items: [{ id: 31, done: true }],
    });

    await user.click(screen.getByRole('button', { name: 'Send by e-mail' }));
    const dialog = await screen.findByRole('dialog');
    await user.click(within(dialog).getByRole('button', { name: 'Send' }));
    expect(await within(dialog).findByText('Tick at least one person.')).toBeInTheDocument();
    await user.click(await within(dialog).findByRole('checkbox', { name: /Kit/ }));
    await user.click(within(dialog).getByRole('button', { name: 'Send' }));
    expect(await screen.findByText('The plan is on its way to Kit.')).toBeInTheDocument();
    await waitFor(() =>
      expect(requests.find((r) => r.path === '/review-plans/5/send')?.body).toEqual({
        memberIds: [2],
      }),
    );
  });

  it('lets a tutor download but not e-mail, and lists plans with their progress', async () => {
    mockApi({
      'GET /auth/me': json(200, tutorMe),
      'GET /students': list([students[0]]),
      'GET /review-plans?studentId=1&pageSize=100': list([
        { ...plan, missCount: 1, progress: { done: 1, total: 2 } },
      ]),
      'GET /review-plans/5': json(200, plan),
    });
    const user = userEvent.setup();
    renderApp('/review-plans');
    const plans = await screen.findByRole('list', { name: 'Review plans for Juniper' });
    expect(within(plans).getByText('1 of 2 done')).toBeInTheDocument();
    await user.click(within(plans).getByRole('link', { name: /Review on/ }));
    expect(await screen.findByRole('button', { name: 'Download PDF' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Send by e-mail' })).not.toBeInTheDocument();
  });
});

describe('a word problem on a plan', () => {
  it('lists its number sentences with their verdicts, the first that differs marked, and the stage', async () => {
    // 60 − 18 = 42 by plain arithmetic: line 2 differs and line 3 goes on with its 58.
    const lines = [
      {
        line: 1,
        text: '4 x 15 = 60',
        ok: true,
        written: '60',
        expected: '60',
        followsFrom: null,
        verdict: 'Right',
      },
      {
        line: 2,
        text: '60 - 18 = 58',
        ok: false,
        written: '58',
        expected: '42',
        followsFrom: null,
        verdict: 'Differs: this comes to 42 · the first line that differs',
      },
      {
        line: 3,
        text: '58 + 7 = 65',
        ok: true,
        written: '65',
        expected: '65',
        followsFrom: 2,
        verdict: 'Right · follows from line 2',
      },
    ];
    mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /review-plans/5': json(200, {
        ...plan,
        misses: [
          {
            id: 41,
            occurredOn: '2026-03-09',
            problem: 'Pencils: 4 boxes of 15, 18 given away, 7 bought',
            answer: '65',
            expected: null,
            explanation: '',
            cause: 'step',
            status: 'planned',
            ruleIds: ['sub.smaller-from-larger'],
            firstWrongStep: null,
            ruleExplanation: null,
            working: null,
            lines,
            firstWrongLine: 2,
            stage: 'process',
          },
        ],
      }),
    });
    renderApp('/review-plans/5');
    const list = await screen.findByRole('list', { name: 'Number sentences' });
    const items = within(list).getAllByRole('listitem');
    expect(items.map((i) => i.textContent)).toEqual([
      '1.4 x 15 = 60Right',
      '2.60 - 18 = 58Differs: this comes to 42 · the first line that differs',
      '3.58 + 7 = 65Right · follows from line 2',
    ]);
    expect(items[1]).toHaveClass('wb-plan-line-first');
    expect(items[2]).not.toHaveClass('wb-plan-line-first');
    expect(
      screen.getByText('Where it went wrong: “Work it” (doing the arithmetic).'),
    ).toBeVisible();
  });
});

describe('a plan’s re-work item with written partial products', () => {
  it('draws the partials the child wrote beside the usual ones, the first that differs marked', async () => {
    // Issue 11's example: 347 × 26 answered 8,922 with partials 2,082 and 6,840;
    // 347 × 6 = 2,082 and 347 × 20 = 6,940 (worked by hand). The report is the engine's own.
    const d = diagnose('347 x 26', '8922', { steps: { partials: ['2082', '6840'] } });
    if (!d.ok || !d.writtenSteps) throw new Error('no written steps');
    mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /review-plans/5': json(200, {
        ...plan,
        misses: [
          {
            id: 41,
            occurredOn: '2026-03-09',
            problem: '347 x 26',
            answer: '8922',
            expected: '9022',
            explanation: '',
            cause: 'slip',
            status: 'planned',
            ruleIds: [],
            firstWrongStep: null,
            ruleExplanation: null,
            working: null,
            writtenSteps: d.writtenSteps,
          },
        ],
      }),
    });
    renderApp('/review-plans/5');
    const list = await screen.findByRole('list', {
      name: 'The partial products the child wrote',
    });
    const items = within(list).getAllByRole('listitem');
    expect(items).toHaveLength(2);
    expect(items[0]).toHaveTextContent(
      /partial product 1 \(347 × 6\): wrote 2082 · usual 2082 · same/,
    );
    expect(items[1]).toHaveTextContent(
      /partial product 2 .*wrote 6840 · usual 6940 · the first that differs/,
    );
    expect(items[1]).toHaveClass('wb-plan-line-first');
    expect(items[0]).not.toHaveClass('wb-plan-line-first');
  });
});
