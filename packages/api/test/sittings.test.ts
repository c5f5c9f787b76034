import { getConnectionToken } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
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
let wren: number;
let milo: number;
let key: { id: number; items: { id: number; number: number }[] };

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  tutor = await signedIn(t, DEMO.tutor);
  stranger = await registered(t, 'sittings-stranger@example.test', 'Elsewhere');
  const students = (await owner.get('/api/students').expect(200)).body.items as {
    id: number;
    name: string;
  }[];
  wren = students.find((s) => s.name === 'Wren')!.id;
  milo = students.find((s) => s.name === 'Milo')!.id;
  const res = await owner
    .post('/api/answer-keys', {
      title: 'Sitting key',
      kind: 'assessment',
      items: [
        { number: 1, prompt: '81 - 38', answer: '43', skills: ['subtraction'], revisit: ['5'] },
        { number: 2, prompt: '304 - 75', answer: '229', skills: ['zeros'], revisit: ['6-7'] },
        { number: 3, prompt: '58 + 67', answer: '125', skills: ['addition'], revisit: ['3'] },
        { number: 4, prompt: '27 x 4', answer: '108', facts: ['fours'] },
      ],
    })
    .expect(201);
  key = res.body;
});
afterAll(() => t.close());

const item = (n: number) => key.items.find((i) => i.number === n)!.id;

async function sitting(studentId: number, startedAt: string, conditions?: object) {
  const res = await owner.post('/api/sittings', {
    studentId,
    answerKeyId: key.id,
    startedAt,
    minutes: 20,
    ...(conditions && { conditions }),
  });
  expect(res.status, res.text).toBe(201);
  return res.body as { id: number; timeOfDay: string };
}

const emptyChanges = {
  heldItemIds: [],
  createdMissIds: [],
  reopenedMissIds: [],
  resolvedMissIds: [],
  updatedMissIds: [],
};

function putMarks(id: number, marks: object[]) {
  return owner.send('put', `/api/sittings/${id}/marks`, { marks });
}

/** A sitting of Wren's with item 1 marked wrong (a miss) and item 2 right, saved once. */
async function markedOnce(startedAt: string) {
  const s = await sitting(wren, startedAt);
  const marks = [
    { keyItemId: item(1), correct: false, answer: '57' },
    { keyItemId: item(2), correct: true },
  ];
  const first = await putMarks(s.id, marks).expect(200);
  return { s, marks, first };
}

async function missesOf(sittingId: number) {
  const res = await owner.get(`/api/misses?studentId=${wren}&pageSize=100`).expect(200);
  return (res.body.items as { id: number; sittingId: number | null; status: string }[]).filter(
    (m) => m.sittingId === sittingId,
  );
}

describe('sittings', () => {
  it('starts a sitting and answers it in the documented shape', async () => {
    const res = await owner.post('/api/sittings', {
      studentId: wren,
      answerKeyId: key.id,
      startedAt: '2026-02-02T09:30',
      minutes: 25,
      conditions: { rested: true, afterMeal: false, note: ' after a walk ' },
    });
    expect(res.status, res.text).toBe(201);
    expect(res.body).toMatchObject({
      studentId: wren,
      answerKeyId: key.id,
      answerKey: { id: key.id, title: 'Sitting key', kind: 'assessment' },
      startedAt: '2026-02-02T09:30',
      date: '2026-02-02',
      timeOfDay: 'morning',
      minutes: 25,
      conditions: { rested: true, afterMeal: false, note: 'after a walk' },
      score: { items: 4, correct: 0, marked: 0, wrong: 0, percent: null },
      marks: [],
    });
  });

  it.each([
    // The bands are ours (documented in src/sittings/time-of-day.ts): edges on both sides.
    ['2026-02-02T04:59', 'evening'],
    ['2026-02-02T05:00', 'morning'],
    ['2026-02-02T10:59', 'morning'],
    ['2026-02-02T11:00', 'midday'],
    ['2026-02-02T13:59', 'midday'],
    ['2026-02-02T14:00', 'afternoon'],
    ['2026-02-02T17:59', 'afternoon'],
    ['2026-02-02T18:00', 'evening'],
    ['2026-02-02T23:30:15', 'evening'],
  ])('reads %s as %s', async (startedAt, band) => {
    const s = await sitting(milo, startedAt);
    expect(s.timeOfDay).toBe(band);
  });

  it('names the field for bad input and saves nothing', async () => {
    const before = (await owner.get(`/api/sittings?studentId=${wren}`).expect(200)).body.total;
    const cases: [object, string][] = [
      [{ startedAt: '2026-02-02T09:30:00Z' }, 'startedAt'],
      [{ startedAt: '2026-02-30T09:30' }, 'startedAt'],
      [{ startedAt: '2026-02-02 9:30' }, 'startedAt'],
      [{ startedAt: '2999-01-01T09:30' }, 'startedAt'],
      [{ minutes: 0 }, 'minutes'],
      [{ conditions: { rested: 'yes' } }, 'conditions.rested'],
      [{ studentId: 'Wren' }, 'studentId'],
    ];
    for (const [change, field] of cases) {
      const res = await owner.post('/api/sittings', {
        studentId: wren,
        answerKeyId: key.id,
        startedAt: '2026-02-02T09:30',
        ...change,
      });
      expect(res.status, JSON.stringify(change)).toBe(400);
      expect(Object.keys(res.body.fields), JSON.stringify(change)).toEqual([field]);
    }
    const theirs = await stranger
      .post('/api/answer-keys', { title: 'Theirs', kind: 'review', items: [] })
      .expect(201);
    const foreignKey = await owner.post('/api/sittings', {
      studentId: wren,
      answerKeyId: theirs.body.id,
      startedAt: '2026-02-02T09:30',
    });
    expect(foreignKey.status).toBe(404);
    const foreignStudent = await stranger.post('/api/sittings', {
      studentId: wren,
      answerKeyId: theirs.body.id,
      startedAt: '2026-02-02T09:30',
    });
    expect(foreignStudent.status).toBe(404);
    expect((await owner.get(`/api/sittings?studentId=${wren}`).expect(200)).body.total).toBe(
      before,
    );
  });
});

describe('marks and misses', () => {
  it('makes one miss per wrong item, with the key’s skills and lessons, and the engine’s diagnosis', async () => {
    const s = await sitting(wren, '2026-02-03T10:00');
    const res = await putMarks(s.id, [
      { keyItemId: item(1), correct: false, answer: '57' },
      { keyItemId: item(2), correct: false, answer: '139' },
      { keyItemId: item(3), correct: true },
      { keyItemId: item(4), correct: false, answer: '' },
    ]);
    expect(res.status, res.text).toBe(200);
    expect(res.body.score).toEqual({ items: 4, correct: 1, marked: 4, wrong: 3, percent: 25 });
    // The items' writes are sent together; what they made is still told in the items' order.
    expect(res.body.misses.createdMissIds).toEqual(
      [0, 1, 3].map((i) => res.body.marks[i].missId as number),
    );
    expect(
      res.body.marks.map((m: { number: number; missId: number | null }) => [
        m.number,
        m.missId !== null,
      ]),
    ).toEqual([
      [1, true],
      [2, true],
      [3, false],
      [4, true],
    ]);
    const miss2 = res.body.marks[1].missId as number;
    const detail = await owner.get(`/api/misses/${miss2}`).expect(200);
    expect(detail.body).toMatchObject({
      studentId: wren,
      occurredOn: '2026-02-03',
      sittingId: s.id,
      keyItemId: item(2),
      problem: '304 - 75',
      answer: '139',
      status: 'logged',
      skills: ['zeros'],
      revisit: ['6', '7'],
      expected: '229',
      correct: false,
    });
    // 304 − 75 → 139 is the borrow-across-zero example of DESIGN.md's error rule catalog.
    expect(detail.body.ruleIds).toContain('sub.borrow-across-zero');
    expect(detail.body.diagnosis.engineVersion).toEqual(expect.any(String));
    const blank = await owner.get(`/api/misses/${res.body.marks[3].missId}`).expect(200);
    expect(blank.body).toMatchObject({ answer: '', checked: false });
  });

  it('takes the cause for a wrong item when the parent already knows it', async () => {
    const s = await sitting(wren, '2026-02-03T11:00');
    const res = await putMarks(s.id, [
      { keyItemId: item(4), correct: false, answer: '28', cause: 'fact' },
    ]).expect(200);
    const miss = await owner.get(`/api/misses/${res.body.marks[0].missId}`).expect(200);
    expect(miss.body.cause).toBe('fact');
    const bad = await putMarks(s.id, [{ keyItemId: item(4), correct: false, cause: 'lazy' }]);
    expect(bad.body.fields).toEqual({
      'marks.0.cause': 'cause must be one of slip, fact, concept, step, reading, copying, unsure',
    });
  });

  it('creates nothing new when the same marks are saved again', async () => {
    const { s, marks, first } = await markedOnce('2026-02-04T10:00');
    const second = await putMarks(s.id, marks).expect(200);
    expect(second.body.misses).toEqual(emptyChanges);
    expect(second.body.marks).toEqual(first.body.marks);
    expect(await missesOf(s.id)).toHaveLength(1);
  });

  it('answers marks sent again as saved while another write holds the database', async () => {
    const { s, marks, first } = await markedOnce('2026-02-04T14:00');
    let release!: () => void;
    const held = t.app
      .get<Sequelize>(getConnectionToken())
      .transaction(() => new Promise<void>((resolve) => (release = resolve)));
    // Not a timing: a deadline, so a save that queued behind `held` fails here, not by hanging.
    const deadline = new Promise<'still waiting'>((r) =>
      setTimeout(() => r('still waiting'), 20_000),
    );
    try {
      const again = await Promise.race([putMarks(s.id, [...marks].reverse()), deadline]);
      expect(again === 'still waiting' ? again : again.body).toEqual({
        ...first.body,
        misses: emptyChanges,
      });
      // A save naming an item twice is refused as before, without the lock either.
      const twice = await Promise.race([putMarks(s.id, [...marks, marks[0]!]), deadline]);
      expect(twice === 'still waiting' ? twice : twice.body.fields).toEqual({
        'marks.2.keyItemId': 'item 1 is marked twice (also marks.0)',
      });
    } finally {
      release();
      await held;
    }
    expect(await missesOf(s.id)).toHaveLength(1);
  });

  it('saves a sitting’s first marks sent six times at once (a second tap, two parents) once, answering each', async () => {
    const s = await sitting(wren, '2026-02-04T16:00');
    const marks = [
      { keyItemId: item(1), correct: false, answer: '57' },
      { keyItemId: item(2), correct: false, answer: '339' },
      { keyItemId: item(3), correct: true },
    ];
    // On PostgreSQL, without the sitting's row lock, all but the first failed 409 on the
    // marks' unique index: each read no marks, then inserted them.
    const saves = await Promise.all(Array.from({ length: 6 }, () => putMarks(s.id, marks)));
    expect(saves.map((r) => `${r.status} ${r.status === 200 ? '' : r.text}`)).toEqual(
      Array(6).fill('200 '),
    );
    const created = saves.flatMap((r) => r.body.misses.createdMissIds as number[]);
    expect(created).toHaveLength(2);
    const whole = await owner.get(`/api/sittings/${s.id}`).expect(200);
    expect(whole.body.marks.map((m: { number: number }) => m.number).sort()).toEqual([1, 2, 3]);
    expect((await missesOf(s.id)).map((m) => m.id).sort()).toEqual([...created].sort());

    // Then all turned right at once: each miss resolved once, by one of the saves.
    const right = marks.map((m) => ({ keyItemId: m.keyItemId, correct: true }));
    const turned = await Promise.all(Array.from({ length: 6 }, () => putMarks(s.id, right)));
    expect(turned.map((r) => r.status)).toEqual(Array(6).fill(200));
    const resolved = turned.flatMap((r) => r.body.misses.resolvedMissIds as number[]);
    expect(resolved.sort()).toEqual([...created].sort());
    expect((await missesOf(s.id)).map((m) => m.status)).toEqual(['resolved', 'resolved']);
  });

  it('resolves the miss when a wrong mark turns right, and reopens it when it turns wrong again', async () => {
    const s = await sitting(wren, '2026-02-05T10:00');
    const made = await putMarks(s.id, [
      { keyItemId: item(1), correct: false, answer: '57' },
    ]).expect(200);
    const missId = made.body.misses.createdMissIds[0] as number;
    const right = await putMarks(s.id, [{ keyItemId: item(1), correct: true }]).expect(200);
    expect(right.body.misses.resolvedMissIds).toEqual([missId]);
    const resolved = await owner.get(`/api/misses/${missId}`).expect(200);
    expect(resolved.body.status).toBe('resolved');
    expect(resolved.body.note).toBe('Resolved: the mark was changed to right');
    const again = await putMarks(s.id, [
      { keyItemId: item(1), correct: false, answer: '53' },
    ]).expect(200);
    expect(again.body.misses).toMatchObject({ createdMissIds: [], reopenedMissIds: [missId] });
    const reopened = await owner.get(`/api/misses/${missId}`).expect(200);
    expect(reopened.body).toMatchObject({ status: 'logged', answer: '53' });
    // 81 − 38 → 53 is the borrow-no-decrement example of DESIGN.md's catalog.
    expect(reopened.body.ruleIds).toContain('sub.borrow-no-decrement');
    const retyped = await putMarks(s.id, [
      { keyItemId: item(1), correct: false, answer: '57' },
    ]).expect(200);
    expect(retyped.body.misses.updatedMissIds).toEqual([missId]);
    expect((await owner.get(`/api/misses/${missId}`)).body.answer).toBe('57');
    const unmarked = await putMarks(s.id, []).expect(200);
    expect(unmarked.body.misses.resolvedMissIds).toEqual([missId]);
    expect(unmarked.body.marks).toEqual([]);
    expect(await missesOf(s.id)).toHaveLength(1);
  });

  it('keeps a miss the parent resolved by hand when the same marks are saved again', async () => {
    const s = await sitting(wren, '2026-02-06T10:00');
    const marks = [{ keyItemId: item(3), correct: false, answer: '115' }];
    const made = await putMarks(s.id, marks).expect(200);
    const missId = made.body.misses.createdMissIds[0] as number;
    await owner.send('patch', `/api/misses/${missId}`, { status: 'resolved' }).expect(200);
    await putMarks(s.id, marks).expect(200);
    expect((await owner.get(`/api/misses/${missId}`)).body.status).toBe('resolved');
  });

  it('refuses marks for items of another key or marked twice, and saves none of them', async () => {
    const s = await sitting(wren, '2026-02-07T10:00');
    await putMarks(s.id, [{ keyItemId: item(1), correct: true }]).expect(200);
    const other = await owner
      .post('/api/answer-keys', {
        title: 'Other',
        kind: 'review',
        items: [{ number: 1, prompt: '1 + 1', answer: '2' }],
      })
      .expect(201);
    const res = await putMarks(s.id, [
      { keyItemId: item(2), correct: false, answer: '139' },
      { keyItemId: other.body.items[0].id, correct: true },
      { keyItemId: item(2), correct: true },
    ]);
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({
      'marks.1.keyItemId': `item ${other.body.items[0].id} is not in this sitting’s key`,
      'marks.2.keyItemId': 'item 2 is marked twice (also marks.0)',
    });
    const bad = await putMarks(s.id, [{ keyItemId: item(1), correct: 'yes' }]);
    expect(bad.body.fields).toEqual({ 'marks.0.correct': 'correct must be true or false' });
    const now = await owner.get(`/api/sittings/${s.id}`).expect(200);
    expect(now.body.marks).toEqual([
      expect.objectContaining({ keyItemId: item(1), correct: true }),
    ]);
    expect(await missesOf(s.id)).toEqual([]);
  });
});

describe('summary', () => {
  it('scores a student over time, by time of day and by condition', async () => {
    const kid = (
      await owner.post('/api/students', { name: 'Summary', gradeLevel: '3' }).expect(201)
    ).body.id as number;
    const plan: [string, object, boolean[]][] = [
      ['2026-01-12T09:00', { rested: true, afterMeal: true }, [true, true, true, false]],
      ['2026-01-13T15:30', { rested: false, afterMeal: false }, [true, false, false, false]],
      ['2026-01-14T09:45', { rested: true }, [true, true, true, true]],
      ['2026-01-15T19:10', {}, [true, true, false, false]],
    ];
    for (const [startedAt, conditions, results] of plan) {
      const s = await sitting(kid, startedAt, conditions);
      await putMarks(
        s.id,
        results.map((correct, i) => ({
          keyItemId: item(i + 1),
          correct,
          answer: correct ? null : '0',
        })),
      ).expect(200);
    }
    await sitting(kid, '2026-01-16T12:00');
    const res = await owner.get(`/api/students/${kid}/sittings/summary`).expect(200);
    expect(res.body.sittings).toBe(4);
    expect(res.body.overall).toEqual({
      sittings: 4,
      correct: 10,
      marked: 16,
      wrong: 6,
      percent: 63,
    });
    expect(
      res.body.overTime.map((s: { date: string; percent: number | null }) => [s.date, s.percent]),
    ).toEqual([
      ['2026-01-12', 75],
      ['2026-01-13', 25],
      ['2026-01-14', 100],
      ['2026-01-15', 50],
      ['2026-01-16', null],
    ]);
    expect(res.body.byTimeOfDay).toEqual([
      {
        timeOfDay: 'morning',
        from: '05:00',
        to: '10:59',
        sittings: 2,
        correct: 7,
        marked: 8,
        wrong: 1,
        percent: 88,
      },
      {
        timeOfDay: 'midday',
        from: '11:00',
        to: '13:59',
        sittings: 0,
        correct: 0,
        marked: 0,
        wrong: 0,
        percent: null,
      },
      {
        timeOfDay: 'afternoon',
        from: '14:00',
        to: '17:59',
        sittings: 1,
        correct: 1,
        marked: 4,
        wrong: 3,
        percent: 25,
      },
      {
        timeOfDay: 'evening',
        from: '18:00',
        to: '04:59',
        sittings: 1,
        correct: 2,
        marked: 4,
        wrong: 2,
        percent: 50,
      },
    ]);
    expect(res.body.byCondition.rested).toEqual({
      yes: { sittings: 2, correct: 7, marked: 8, wrong: 1, percent: 88 },
      no: { sittings: 1, correct: 1, marked: 4, wrong: 3, percent: 25 },
      notNoted: { sittings: 1, correct: 2, marked: 4, wrong: 2, percent: 50 },
    });
    expect(res.body.byCondition.afterMeal.yes).toMatchObject({ sittings: 1, percent: 75 });
    expect(res.body.caution).toMatch(/not evidence/);
    const ranged = await owner
      .get(`/api/students/${kid}/sittings/summary?from=2026-01-13&to=2026-01-14`)
      .expect(200);
    expect(ranged.body.overTime.map((s: { date: string }) => s.date)).toEqual([
      '2026-01-13',
      '2026-01-14',
    ]);
    const backwards = await owner.get(
      `/api/students/${kid}/sittings/summary?from=2026-01-14&to=2026-01-13`,
    );
    expect(backwards.body.fields).toEqual({ to: 'to must be on or after from' });
  });
});

describe('who may', () => {
  it('shows a tutor the sittings of the granted child only, and lets them change nothing', async () => {
    const ofWren = await sitting(wren, '2026-02-09T09:00');
    const ofMilo = await sitting(milo, '2026-02-09T09:00');
    const list = await tutor.get('/api/sittings?pageSize=100').expect(200);
    const students = new Set((list.body.items as { studentId: number }[]).map((s) => s.studentId));
    expect([...students]).toEqual([wren]);
    await tutor.get(`/api/sittings/${ofWren.id}`).expect(200);
    await tutor.get(`/api/sittings/${ofMilo.id}`).expect(404);
    await tutor.get(`/api/students/${wren}/sittings/summary`).expect(200);
    await tutor.get(`/api/students/${milo}/sittings/summary`).expect(404);
    await tutor.get(`/api/sittings?studentId=${milo}`).expect(404);
    expect(
      (
        await tutor.post('/api/sittings', {
          studentId: wren,
          answerKeyId: key.id,
          startedAt: '2026-02-09T09:00',
        })
      ).status,
    ).toBe(403);
    expect(
      (await tutor.send('put', `/api/sittings/${ofWren.id}/marks`, { marks: [] })).status,
    ).toBe(403);
  });

  it('answers 404 to another household', async () => {
    const s = await sitting(wren, '2026-02-10T09:00');
    await stranger.get(`/api/sittings/${s.id}`).expect(404);
    expect((await stranger.send('put', `/api/sittings/${s.id}/marks`, { marks: [] })).status).toBe(
      404,
    );
    await stranger.get(`/api/students/${wren}/sittings/summary`).expect(404);
    const list = await stranger.get('/api/sittings').expect(200);
    expect(list.body.total).toBe(0);
  });
});
