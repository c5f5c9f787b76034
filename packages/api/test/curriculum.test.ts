import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  type Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

let t: TestApp;
let owner: Client;
let tutor: Client;
let stranger: Client;

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  tutor = await signedIn(t, DEMO.tutor);
  stranger = await registered(t, 'curriculum-stranger@example.test', 'Elsewhere');
});
afterAll(() => t.close());

async function newCourse(name = 'Invented Paths, level 3') {
  const res = await owner.post('/api/courses', { name, level: 'Level 3' }).expect(201);
  return res.body as { id: number; name: string };
}

async function addLesson(courseId: number, number: number, skills: string[] = []) {
  const res = await owner
    .post(`/api/courses/${courseId}/lessons`, { number, title: `Lesson ${number}`, skills })
    .expect(201);
  return res.body as { id: number; number: number };
}

describe('courses', () => {
  it('creates, lists with a lesson count, reads with lessons in order and edits', async () => {
    const course = await newCourse();
    await addLesson(course.id, 12, ['regrouping', 'subtraction']);
    await addLesson(course.id, 3, ['place value']);
    const list = await owner.get('/api/courses').expect(200);
    expect(list.body.items).toContainEqual(
      expect.objectContaining({
        id: course.id,
        name: course.name,
        level: 'Level 3',
        lessonCount: 2,
      }),
    );
    const one = await owner.get(`/api/courses/${course.id}`).expect(200);
    expect(one.body.lessons.map((l: { number: number }) => l.number)).toEqual([3, 12]);
    expect(one.body.lessons[1]).toMatchObject({
      courseId: course.id,
      title: 'Lesson 12',
      skills: ['regrouping', 'subtraction'],
    });
    const patched = await owner
      .send('patch', `/api/courses/${course.id}`, { name: '  Renamed paths ', level: '' })
      .expect(200);
    expect(patched.body).toMatchObject({ name: 'Renamed paths', level: null, lessonCount: 2 });
  });

  it('names the field for bad input and saves nothing', async () => {
    const before = (await owner.get('/api/courses').expect(200)).body.total as number;
    const blank = await owner.post('/api/courses', { name: '   ' });
    expect(blank.status).toBe(400);
    expect(blank.body.fields).toHaveProperty('name');
    const extra = await owner.post('/api/courses', { name: 'Ok', householdId: 1 });
    expect(extra.status).toBe(400);
    expect(extra.body.fields).toHaveProperty('householdId');
    expect((await owner.get('/api/courses').expect(200)).body.total).toBe(before);
  });

  it('refuses to delete a course that answer keys use, naming them', async () => {
    const course = await newCourse('Course with a key');
    await owner
      .post('/api/answer-keys', {
        title: 'Keyed sheet',
        kind: 'worksheet',
        courseId: course.id,
        items: [],
      })
      .expect(201);
    const res = await owner.send('delete', `/api/courses/${course.id}`);
    expect(res.status).toBe(409);
    expect(res.body.message).toContain('answer key “Keyed sheet”');
    await owner.get(`/api/courses/${course.id}`).expect(200);
  });

  it('deletes an unused course with its lessons', async () => {
    const course = await newCourse('Short-lived');
    await addLesson(course.id, 1);
    await owner.send('delete', `/api/courses/${course.id}`).expect(204);
    await owner.get(`/api/courses/${course.id}`).expect(404);
    await owner.get(`/api/courses/${course.id}/lessons`).expect(404);
  });
});

describe('lessons', () => {
  it('refuses a lesson number already in the course with 409 naming the field', async () => {
    const course = await newCourse();
    await addLesson(course.id, 5);
    const res = await owner.post(`/api/courses/${course.id}/lessons`, {
      number: 5,
      title: 'Again',
    });
    expect(res.status).toBe(409);
    expect(res.body.fields).toEqual({ number: 'lesson 5 already exists in this course' });
    const list = await owner.get(`/api/courses/${course.id}/lessons`).expect(200);
    expect(list.body.total).toBe(1);
  });

  it('checks number, title and skills', async () => {
    const course = await newCourse();
    const zero = await owner.post(`/api/courses/${course.id}/lessons`, { number: 0, title: 'x' });
    expect(zero.body.fields).toEqual({ number: 'number must be 1 or more' });
    const text = await owner.post(`/api/courses/${course.id}/lessons`, {
      number: 2,
      title: 'x',
      skills: 'regrouping',
    });
    expect(text.status).toBe(400);
    expect(text.body.fields).toHaveProperty('skills');
    const untitled = await owner.post(`/api/courses/${course.id}/lessons`, { number: 2 });
    expect(untitled.body.fields).toHaveProperty('title');
  });

  it('edits a lesson and moves it to a free number', async () => {
    const course = await newCourse();
    const lesson = await addLesson(course.id, 7);
    await addLesson(course.id, 8);
    const res = await owner
      .send('patch', `/api/lessons/${lesson.id}`, { number: 9, skills: ['rounding'] })
      .expect(200);
    expect(res.body).toMatchObject({ number: 9, skills: ['rounding'] });
    const clash = await owner.send('patch', `/api/lessons/${lesson.id}`, { number: 8 });
    expect(clash.status).toBe(409);
  });

  it('adds one lesson of a number sent five times at once, refusing the rest by name', async () => {
    const course = await newCourse();
    // Each checks the number before any of them has written: without the unique index's
    // answer turned into the service's own, the later ones got "That course_id is already in use".
    const adds = await Promise.all(
      Array.from({ length: 5 }, () =>
        owner.post(`/api/courses/${course.id}/lessons`, { number: 4, title: 'Lesson 4' }),
      ),
    );
    expect(adds.map((r) => r.status).sort()).toEqual([201, 409, 409, 409, 409]);
    for (const r of adds.filter((a) => a.status === 409)) {
      expect(r.body).toMatchObject({
        message: 'Lesson 4 already exists in this course',
        fields: { number: 'lesson 4 already exists in this course' },
      });
    }
    const list = await owner.get(`/api/courses/${course.id}/lessons`).expect(200);
    expect(list.body.items.map((l: { number: number }) => l.number)).toEqual([4]);
  });

  it('moves one of five lessons sent to the same number at once, refusing the rest by name', async () => {
    const course = await newCourse();
    const lessons = [];
    for (const n of [1, 2, 3, 4, 5]) lessons.push(await addLesson(course.id, n));
    const moves = await Promise.all(
      lessons.map((l) => owner.send('patch', `/api/lessons/${l.id}`, { number: 9 })),
    );
    expect(moves.map((r) => r.status).sort()).toEqual([200, 409, 409, 409, 409]);
    for (const r of moves.filter((m) => m.status === 409)) {
      expect(r.body).toMatchObject({
        message: 'Lesson 9 already exists in this course',
        fields: { number: 'lesson 9 already exists in this course' },
      });
    }
    const moved = moves.findIndex((m) => m.status === 200);
    const list = await owner.get(`/api/courses/${course.id}/lessons`).expect(200);
    const numbers = [1, 2, 3, 4, 5].filter((_, i) => i !== moved);
    expect(list.body.items.map((l: { number: number }) => l.number)).toEqual([...numbers, 9]);
  });

  it('refuses to delete or renumber a lesson a key item revisits, naming the item', async () => {
    const course = await newCourse('In use');
    const used = await addLesson(course.id, 31);
    await addLesson(course.id, 32);
    await addLesson(course.id, 33);
    const free = await addLesson(course.id, 40);
    const unknown = await owner.post('/api/answer-keys', {
      title: 'Review 2',
      kind: 'review',
      courseId: course.id,
      items: [
        { number: 1, prompt: '81 - 38', answer: '43', revisit: ['12'] },
        { number: 4, prompt: '304 - 75', answer: '229', revisit: ['31-33'] },
      ],
    });
    expect(unknown.status).toBe(400);
    expect(unknown.body.fields).toEqual({ 'items.0.revisit': 'lesson 12 is not in “In use”' });
    await owner
      .post('/api/answer-keys', {
        title: 'Review 2',
        kind: 'review',
        courseId: course.id,
        items: [
          { number: 1, prompt: '81 - 38', answer: '43', revisit: ['32'] },
          { number: 4, prompt: '304 - 75', answer: '229', revisit: ['31-33'] },
        ],
      })
      .expect(201);
    const del = await owner.send('delete', `/api/lessons/${used.id}`);
    expect(del.status).toBe(409);
    expect(del.body.message).toBe('Lesson 31 cannot be deleted: it is used by “Review 2” item 4');
    const renumber = await owner.send('patch', `/api/lessons/${used.id}`, { number: 50 });
    expect(renumber.status).toBe(409);
    const list = await owner.get(`/api/courses/${course.id}/lessons`).expect(200);
    expect(list.body.items.map((l: { number: number }) => l.number)).toEqual([31, 32, 33, 40]);
    await owner.send('delete', `/api/lessons/${free.id}`).expect(204);
  });

  it('refuses to delete the lesson a key is for', async () => {
    const course = await newCourse('Keyed lesson');
    const lesson = await addLesson(course.id, 14);
    await owner
      .post('/api/answer-keys', {
        title: 'Worksheet 14',
        kind: 'worksheet',
        courseId: course.id,
        lessonNumber: 14,
        items: [{ number: 1, prompt: '58 + 67', answer: '125' }],
      })
      .expect(201);
    const res = await owner.send('delete', `/api/lessons/${lesson.id}`);
    expect(res.status).toBe(409);
    expect(res.body.message).toContain('answer key “Worksheet 14”');
  });
});

describe('who may', () => {
  it('lets a tutor read the curriculum but not change it', async () => {
    const course = await newCourse('Tutor reads');
    const lesson = await addLesson(course.id, 1);
    await tutor.get(`/api/courses/${course.id}`).expect(200);
    await tutor.get(`/api/courses/${course.id}/lessons`).expect(200);
    expect((await tutor.post('/api/courses', { name: 'Nope' })).status).toBe(403);
    expect(
      (await tutor.post(`/api/courses/${course.id}/lessons`, { number: 2, title: 'x' })).status,
    ).toBe(403);
    expect((await tutor.send('patch', `/api/lessons/${lesson.id}`, { title: 'x' })).status).toBe(
      403,
    );
    expect((await tutor.send('delete', `/api/courses/${course.id}`)).status).toBe(403);
  });

  it('answers 404 to another household for every course and lesson route', async () => {
    const course = await newCourse('Private');
    const lesson = await addLesson(course.id, 1);
    await stranger.get(`/api/courses/${course.id}`).expect(404);
    await stranger.get(`/api/courses/${course.id}/lessons`).expect(404);
    expect(
      (await stranger.post(`/api/courses/${course.id}/lessons`, { number: 2, title: 'x' })).status,
    ).toBe(404);
    expect((await stranger.send('patch', `/api/courses/${course.id}`, { name: 'x' })).status).toBe(
      404,
    );
    expect((await stranger.send('patch', `/api/lessons/${lesson.id}`, { title: 'x' })).status).toBe(
      404,
    );
    expect((await stranger.send('delete', `/api/lessons/${lesson.id}`)).status).toBe(404);
    expect((await stranger.send('delete', `/api/courses/${course.id}`)).status).toBe(404);
    const list = await stranger.get('/api/courses').expect(200);
    expect(list.body.items.some((c: { id: number }) => c.id === course.id)).toBe(false);
  });
});

describe('the demo scenario', () => {
  it('has a course, three kinds of key, weeks of sittings and the misprint flagged', async () => {
    const courses = (await owner.get('/api/courses').expect(200)).body.items as {
      name: string;
      lessonCount: number;
    }[];
    expect(courses.find((c) => c.name === 'Number Trail, level 3–4')?.lessonCount).toBe(22);
    const keys = (await owner.get('/api/answer-keys').expect(200)).body.items as {
      id: number;
      title: string;
      kind: string;
      sittingCount: number;
    }[];
    const demo = keys.filter((k) => k.sittingCount > 0);
    expect(demo.map((k) => k.kind).sort()).toEqual(['assessment', 'review', 'worksheet']);
    const assessment = demo.find((k) => k.kind === 'assessment')!;
    const flags = (await owner.get(`/api/answer-keys/${assessment.id}`).expect(200)).body.flags;
    expect(flags.map((f: { message: string }) => f.message)).toEqual([
      'item 4: the key says 1,138, but 47 × 24 = 1,128 — please check',
    ]);
    const students = (await owner.get('/api/students').expect(200)).body.items as {
      id: number;
      name: string;
    }[];
    const wren = students.find((s) => s.name === 'Wren')!.id;
    const summary = (await owner.get(`/api/students/${wren}/sittings/summary`).expect(200)).body;
    const first = summary.overTime[0].date as string;
    const last = summary.overTime.at(-1).date as string;
    expect((Date.parse(last) - Date.parse(first)) / 86_400_000).toBeGreaterThanOrEqual(49);
    const band = (name: string) =>
      summary.byTimeOfDay.find((b: { timeOfDay: string }) => b.timeOfDay === name).percent;
    // The invented pattern a tutor should spot: Wren's afternoons go worse than mornings.
    expect(band('morning')).toBeGreaterThan(band('afternoon'));
    const misses = await tutor.get(`/api/misses?studentId=${wren}&pageSize=100`).expect(200);
    expect(
      (misses.body.items as { sittingId: number | null }[]).some((m) => m.sittingId !== null),
    ).toBe(true);
  });
});
