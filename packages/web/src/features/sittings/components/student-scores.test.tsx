import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';

import { json, mockApi, ownerMe, students } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const group = (sittings: number, correct: number, marked: number) => ({
  sittings,
  correct,
  marked,
  wrong: marked - correct,
  percent: marked ? Math.round((100 * correct) / marked) : null,
});

const summary = {
  studentId: 1,
  from: null,
  to: null,
  sittings: 3,
  overall: group(3, 24, 30),
  overTime: [
    {
      sittingId: 1,
      startedAt: '2026-09-01T09:00',
      date: '2026-09-01',
      answerKeyId: 3,
      title: 'Worksheet 14',
      kind: 'worksheet',
      timeOfDay: 'morning',
      minutes: 20,
      conditions: { rested: true, afterMeal: null },
      ...group(1, 9, 10),
    },
    {
      sittingId: 2,
      startedAt: '2026-09-03T15:00',
      date: '2026-09-03',
      answerKeyId: 3,
      title: 'Review 2',
      kind: 'review',
      timeOfDay: 'afternoon',
      minutes: 25,
      conditions: { rested: false, afterMeal: true },
      ...group(1, 6, 10),
    },
    {
      sittingId: 3,
      startedAt: '2026-09-05T09:30',
      date: '2026-09-05',
      answerKeyId: 3,
      title: 'Test 1',
      kind: 'assessment',
      timeOfDay: 'morning',
      minutes: null,
      conditions: { rested: null, afterMeal: null },
      ...group(1, 9, 10),
    },
  ],
  byTimeOfDay: [
    { timeOfDay: 'morning', from: '05:00', to: '10:59', ...group(2, 18, 20) },
    { timeOfDay: 'midday', from: '11:00', to: '13:59', ...group(0, 0, 0) },
    { timeOfDay: 'afternoon', from: '14:00', to: '17:59', ...group(1, 6, 10) },
    { timeOfDay: 'evening', from: '18:00', to: '04:59', ...group(0, 0, 0) },
  ],
  byCondition: {
    rested: { yes: group(1, 9, 10), no: group(1, 6, 10), notNoted: group(1, 9, 10) },
    afterMeal: { yes: group(1, 6, 10), no: group(0, 0, 0), notNoted: group(2, 18, 20) },
  },
  caution: 'A handful of sittings is not evidence. The best time of day is the family’s call.',
};

describe('the student page', () => {
  it('shows the scores by time of day and condition as text, with the caution', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students/1': json(200, students[0]),
      'GET /students/1/sittings/summary': json(200, summary),
    });
    renderApp('/students/1');
    expect(await screen.findByRole('heading', { name: 'Juniper' })).toBeInTheDocument();
    expect(await screen.findByText('80% right over 3 sittings')).toBeInTheDocument();
    expect(screen.getByText(summary.caution)).toBeInTheDocument();

    const byTime = screen.getByRole('table', { name: 'Scores by time of day' });
    const rows = within(byTime)
      .getAllByRole('row')
      .map((row) => row.textContent);
    expect(rows).toEqual([
      'Time of daySittingsRight',
      'Morning (05:00–10:59)218 of 20 (90%)',
      'Midday (11:00–13:59)0—',
      'Afternoon (14:00–17:59)16 of 10 (60%)',
      'Evening (18:00–04:59)0—',
    ]);
    const byCondition = screen.getByRole('table', { name: 'Scores by condition' });
    expect(byCondition).toHaveTextContent('Well rested90% right over 1 sitting');
    expect(byCondition).toHaveTextContent('Not after a mealno sittings');

    // The line chart's numbers, for screen readers.
    const overTime = screen.getByRole('table', { name: 'Score of each sitting, oldest first' });
    expect(within(overTime).getAllByRole('row')).toHaveLength(4);
    expect(overTime).toHaveTextContent('2026-09-03Review 2Afternoon6 of 10 (60%)');
    expect(screen.getByRole('link', { name: 'Start a sitting' })).toHaveAttribute(
      'href',
      '/sittings/new?studentId=1',
    );
  });

  it('says what to do first when nothing is marked yet', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students/1': json(200, students[0]),
      'GET /students/1/sittings/summary': json(200, { ...summary, sittings: 0, overTime: [] }),
    });
    renderApp('/students/1');
    expect(
      await screen.findByText(
        'No marked sittings for Juniper yet. Start a sitting after a keyed worksheet to see scores here.',
      ),
    ).toBeInTheDocument();
  });
});
