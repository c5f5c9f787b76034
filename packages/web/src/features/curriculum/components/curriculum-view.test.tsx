import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi, ownerMe } from '../../../testing/mock-api';
import { renderApp } from '../../../testing/render';

const course = { id: 2, name: 'Number Trail', level: 'Level 3', lessonCount: 2 };
const lesson = (id: number, number: number, title: string) => ({
  id,
  courseId: 2,
  number,
  title,
  skills: ['subtraction'],
});

describe('Curriculum page', () => {
  it('adds the next lesson from the quick line and shows why a lesson in use stays', async () => {
    let lessons = [lesson(1, 1, 'Numbers to 1,000'), lesson(2, 2, 'Regrouping across a zero')];
    const { requests } = mockApi({
      ...CSRF,
      'GET /auth/me': json(200, ownerMe),
      'GET /courses': () =>
        json(200, { items: [{ ...course, lessonCount: lessons.length }], total: 1 }),
      'GET /courses/2/lessons': () => json(200, { items: lessons, total: lessons.length }),
      'POST /courses/2/lessons': (request) => {
        const body = request.body as { number: number; title: string; skills: string[] };
        const created = { ...lesson(3, body.number, body.title), skills: body.skills };
        lessons = [...lessons, created];
        return json(201, created);
      },
      'DELETE /lessons/2': json(409, {
        statusCode: 409,
        error: 'Conflict',
        message: 'Lesson 2 cannot be deleted: it is used by “Review 2” items 4, 9',
      }),
    });
    renderApp('/curriculum');
    const user = userEvent.setup();
    expect(await screen.findByText('Regrouping across a zero')).toBeInTheDocument();
    expect(screen.getByText('Level 3 · 2 lessons')).toBeInTheDocument();

    const quick = screen.getByRole('form', { name: 'Add a lesson to Number Trail' });
    expect(within(quick).getByLabelText('No.')).toHaveValue('3');
    await user.click(within(quick).getByRole('button', { name: 'Add lesson' }));
    expect(await within(quick).findByText('Give the lesson a title.')).toBeInTheDocument();
    await user.type(within(quick).getByLabelText('New lesson title'), 'Rounding');
    await user.type(
      within(quick).getByLabelText('Skills (with ;)'),
      'rounding; place value{Enter}',
    );
    expect(await screen.findByText('Added lesson 3.')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      number: 3,
      title: 'Rounding',
      skills: ['rounding', 'place value'],
    });
    await waitFor(() => expect(within(quick).getByLabelText('No.')).toHaveValue('4'));
    expect(within(quick).getByLabelText('New lesson title')).toHaveFocus();

    await user.click(screen.getByRole('button', { name: 'Delete lesson 2' }));
    const alert = await screen.findByRole('alertdialog');
    await user.click(within(alert).getByRole('button', { name: 'Delete' }));
    expect(
      await within(alert).findByText(
        'Lesson 2 cannot be deleted: it is used by “Review 2” items 4, 9',
      ),
    ).toBeInTheDocument();
    await user.click(within(alert).getByRole('button', { name: 'Close' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).toBeNull());
    expect(screen.getByText('Regrouping across a zero')).toBeInTheDocument();
  });

  it('says what to do first when there are no courses', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /courses': json(200, { items: [], total: 0 }),
    });
    renderApp('/curriculum');
    expect(
      await screen.findByText(
        'No courses yet. Add the course you teach from, then its numbered lessons.',
      ),
    ).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Add a course' })).toBeInTheDocument();
  });
});
