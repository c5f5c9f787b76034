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
let parent: Client;
let tutor: Client;
let stranger: Client;
let wren: number;
let milo: number;

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  parent = await signedIn(t, DEMO.parent);
  tutor = await signedIn(t, DEMO.tutor);
  stranger = await registered(t, 'keys-stranger@example.test', 'Elsewhere');
  const students = (await owner.get('/api/students').expect(200)).body.items as {
    id: number;
    name: string;
  }[];
  wren = students.find((s) => s.name === 'Wren')!.id;
  milo = students.find((s) => s.name === 'Milo')!.id;
});
afterAll(() => t.close());

interface KeyJson {
  id: number;
  title: string;
  kind: string;
  items: {
    id: number;
    number: number;
    prompt: string;
    answer: string;
    skills: string[];
    revisit: string[];
    revisitLessons: number[];
    facts: string[];
    check: { status: string; expected?: string; message?: string };
  }[];
  flags: { itemId: number; number: number; status: string; expected: string; message: string }[];
  corrections: {
    itemNumber: number;
    changes: Record<string, { from: unknown; to: unknown }>;
    reason: string;
    madeBy: { name: string };
    remarkedSittingIds: number[];
  }[];
}

async function createKey(body: object): Promise<KeyJson> {
  const res = await owner.post('/api/answer-keys', body);
  expect(res.status, res.text).toBe(201);
  return res.body as KeyJson;
}

async function keyCount(): Promise<number> {
  return (await owner.get('/api/answer-keys').expect(200)).body.total as number;
}

/** A sitting of `keyId` started at `startedAt`, marked with `marks`: its id and the marks' answer. */
async function markedSitting(studentId: number, keyId: number, startedAt: string, marks: object[]) {
  const sitting = await owner
    .post('/api/sittings', { studentId, answerKeyId: keyId, startedAt })
    .expect(201);
  const marked = await owner
    .send('put', `/api/sittings/${sitting.body.id}/marks`, { marks })
    .expect(200);
  return {
    id: sitting.body.id as number,
    misses: marked.body.misses as { createdMissIds: number[] },
  };
}

describe('answer keys', () => {
  it('creates a key and answers it in the documented shape', async () => {
    const key = await createKey({
      title: 'Worksheet 9',
      kind: 'worksheet',
      items: [
        {
          number: 2,
          prompt: '304 - 75',
          answer: '229',
          skills: ['subtraction', ' regrouping '],
          revisit: ['7', '31 – 33', 12],
          facts: ['nines'],
        },
        { number: 1, prompt: '58 + 67', answer: '125' },
      ],
    });
    const read = await owner.get(`/api/answer-keys/${key.id}`).expect(200);
    expect(read.body).toMatchObject({
      id: key.id,
      title: 'Worksheet 9',
      kind: 'worksheet',
      courseId: null,
      lessonNumber: null,
      itemCount: 2,
      sittingCount: 0,
      flags: [],
      corrections: [],
    });
    expect(read.body.items.map((i: { number: number }) => i.number)).toEqual([1, 2]);
    expect(read.body.items[1]).toEqual({
      id: expect.any(Number),
      number: 2,
      prompt: '304 - 75',
      answer: '229',
      skills: ['subtraction', 'regrouping'],
      revisit: ['7', '31-33', '12'],
      revisitLessons: [7, 12, 31, 32, 33],
      facts: ['nines'],
      // 304 − 75 = 229 (common practice, no source: column subtraction by hand).
      check: { status: 'agrees', expected: '229' },
    });
    expect(read.body.items[0].skills).toEqual([]);
  });

  it('flags a key answer the engine disagrees with, and never changes it', async () => {
    // Reference: JavaScript BigInt arithmetic (ECMA-262), not the engine: 47 × 24 = 1128.
    expect(47n * 24n).toBe(1128n);
    const key = await createKey({
      title: 'Assessment 3',
      kind: 'assessment',
      items: [
        { number: 11, prompt: '81 - 38', answer: '43' },
        { number: 12, prompt: '47 x 24', answer: '1,138' },
        { number: 13, prompt: 'Nell has 3 bags of 8 shells. How many?', answer: '24' },
        { number: 14, prompt: '45 ÷ 6', answer: 'seven-ish' },
      ],
    });
    expect(key.flags).toEqual([
      {
        itemId: key.items[1]!.id,
        number: 12,
        status: 'disagrees',
        expected: '1128',
        message: 'item 12: the key says 1,138, but 47 × 24 = 1,128 — please check',
      },
      {
        itemId: key.items[3]!.id,
        number: 14,
        status: 'unreadable-answer',
        // Reference: 45 = 6 × 7 + 3 (BigInt check below).
        expected: '7 R 3',
        message:
          'item 14: the key says “seven-ish”, which the checker cannot read; 45 ÷ 6 = 7 R 3 — please check',
      },
    ]);
    expect(45n / 6n).toBe(7n);
    expect(45n % 6n).toBe(3n);
    expect(key.items[2]!.check).toEqual({ status: 'not-checked' });
    expect(key.items[1]!.answer).toBe('1,138');
    const list = await owner.get('/api/answer-keys?kind=assessment').expect(200);
    expect(list.body.items.find((k: { id: number }) => k.id === key.id)).toMatchObject({
      itemCount: 4,
      flagCount: 2,
    });
  });

  it('lists every bad item by index and field, and saves nothing', async () => {
    const before = await keyCount();
    // Shapes are checked first (by the DTO), then what needs the whole key: ranges, numbers.
    const shape = await owner.post('/api/answer-keys', {
      title: 'Broken',
      kind: 'review',
      items: [
        { number: 1, prompt: '58 + 67', answer: '' },
        { number: 2.5, prompt: '81 - 38', answer: '43' },
      ],
    });
    expect(shape.status).toBe(400);
    expect(shape.body.fields).toEqual({
      'items.0.answer': 'answer is missing (1 to 80 characters)',
      'items.1.number': 'number must be a whole number',
    });
    const res = await owner.post('/api/answer-keys', {
      title: 'Broken',
      kind: 'review',
      items: [
        { number: 1, prompt: '58 + 67', answer: '125', revisit: ['3'] },
        { number: 1, prompt: '81 - 38', answer: '43', revisit: ['33-31'] },
        { number: 3, prompt: '81 - 38', answer: '43', revisit: ['three'] },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({
      'items.1.number': 'number 1 is used twice (first at items.0)',
      'items.1.revisit': 'range “33-31” runs backwards; write 31-33',
      'items.2.revisit': '“three” is not a lesson number or a range such as 31-33',
    });
    expect(res.body.message).toMatch(/^2 items have problems; nothing was saved/);
    expect(await keyCount()).toBe(before);
    const kind = await owner.post('/api/answer-keys', { title: 'x', kind: 'quiz', items: [] });
    expect(kind.body.fields).toEqual({
      kind: 'kind must be one of worksheet, review, assessment, check-up',
    });
  });

  it('checks the course and lesson the key belongs to', async () => {
    const noCourse = await owner.post('/api/answer-keys', {
      title: 'x',
      kind: 'worksheet',
      lessonNumber: 4,
      items: [],
    });
    expect(noCourse.body.fields).toEqual({ lessonNumber: 'lessonNumber needs a courseId' });
    const theirs = await stranger.post('/api/courses', { name: 'Their course' }).expect(201);
    const foreign = await owner.post('/api/answer-keys', {
      title: 'x',
      kind: 'worksheet',
      courseId: theirs.body.id,
      items: [],
    });
    expect(foreign.status).toBe(404);
    const course = await owner.post('/api/courses', { name: 'Lesson check' }).expect(201);
    const missing = await owner.post('/api/answer-keys', {
      title: 'x',
      kind: 'worksheet',
      courseId: course.body.id,
      lessonNumber: 4,
      items: [],
    });
    expect(missing.body.fields).toEqual({ lessonNumber: 'lesson 4 is not in “Lesson check”' });
  });

  it('edits a key without sittings freely, recording no corrections', async () => {
    const key = await createKey({
      title: 'Draft',
      kind: 'worksheet',
      items: [
        { number: 1, prompt: '58 + 67', answer: '115' },
        { number: 2, prompt: '81 - 38', answer: '43' },
      ],
    });
    const res = await owner
      .send('patch', `/api/answer-keys/${key.id}`, {
        title: 'Worksheet 10',
        items: [
          { id: key.items[1]!.id, number: 1, prompt: '81 - 38', answer: '43' },
          { id: key.items[0]!.id, number: 2, prompt: '58 + 67', answer: '125' },
          { number: 3, prompt: '365 + 574', answer: '939' },
        ],
      })
      .expect(200);
    expect(res.body.title).toBe('Worksheet 10');
    expect(res.body.items.map((i: { prompt: string }) => i.prompt)).toEqual([
      '81 - 38',
      '58 + 67',
      '365 + 574',
    ]);
    expect(res.body.flags).toEqual([]);
    expect(res.body.corrections).toEqual([]);
    expect(res.body.remarkedSittings).toEqual([]);
    const alien = await owner.send('patch', `/api/answer-keys/${key.id}`, {
      items: [{ id: 999999, number: 1, prompt: '1 + 1', answer: '2' }],
    });
    expect(alien.body.fields).toEqual({ 'items.0.id': 'item 999999 is not in this key' });
  });

  it('deletes a key without sittings and refuses one with sittings', async () => {
    const gone = await createKey({ title: 'Gone', kind: 'review', items: [] });
    await owner.send('delete', `/api/answer-keys/${gone.id}`).expect(204);
    await owner.get(`/api/answer-keys/${gone.id}`).expect(404);
    const kept = await createKey({
      title: 'Kept',
      kind: 'review',
      items: [{ number: 1, prompt: '58 + 67', answer: '125' }],
    });
    await owner
      .post('/api/sittings', {
        studentId: wren,
        answerKeyId: kept.id,
        startedAt: '2026-01-05T09:00',
      })
      .expect(201);
    const res = await owner.send('delete', `/api/answer-keys/${kept.id}`);
    expect(res.status).toBe(409);
    expect(res.body.message).toBe('Answer key “Kept” is used by 1 sitting; it cannot be deleted');
  });
});

describe('corrections', () => {
  it('records a correction and re-marks the sittings, resolving and making misses', async () => {
    const key = await createKey({
      title: 'Assessment 4',
      kind: 'assessment',
      items: [
        { number: 1, prompt: '81 - 38', answer: '43', skills: ['subtraction'], revisit: ['5'] },
        {
          number: 12,
          prompt: '47 x 24',
          answer: '1,138',
          skills: ['partial products'],
          revisit: ['10-11'],
        },
      ],
    });
    const [first, typo] = key.items as [KeyJson['items'][0], KeyJson['items'][0]];
    // Wren wrote the right 1,128 and was marked wrong against the misprinted key.
    const wrenSitting = await markedSitting(wren, key.id, '2026-01-06T09:15', [
      { keyItemId: first.id, correct: true },
      // The checker flags item 12; the parent went by the printed key, so a miss is made.
      { keyItemId: typo.id, correct: false, answer: '1,128', keyAnswerRight: true },
    ]);
    expect(wrenSitting.misses.createdMissIds).toHaveLength(1);
    const wrenMiss = wrenSitting.misses.createdMissIds[0]!;
    // Milo wrote what the misprinted key said and was marked right.
    const miloSitting = await markedSitting(milo, key.id, '2026-01-06T15:40', [
      { keyItemId: first.id, correct: false, answer: '57' },
      { keyItemId: typo.id, correct: true },
    ]);

    const noReason = await owner.send('patch', `/api/answer-keys/${key.id}`, {
      items: [
        { id: first.id, number: 1, prompt: '81 - 38', answer: '43', revisit: ['5'] },
        { id: typo.id, number: 12, prompt: '47 x 24', answer: '1,128', revisit: ['10-11'] },
      ],
    });
    expect(noReason.status).toBe(400);
    expect(Object.keys(noReason.body.fields)).toEqual(['reason']);
    expect((await owner.get(`/api/answer-keys/${key.id}`)).body.items[1].answer).toBe('1,138');

    const res = await parent
      .send('patch', `/api/answer-keys/${key.id}`, {
        reason: 'The printed key had a typo in item 12',
        items: [
          {
            id: first.id,
            number: 1,
            prompt: '81 - 38',
            answer: '43',
            skills: ['subtraction'],
            revisit: ['5'],
          },
          {
            id: typo.id,
            number: 12,
            prompt: '47 x 24',
            answer: '1,128',
            skills: ['partial products'],
            revisit: ['10-11'],
          },
        ],
      })
      .expect(200);
    expect(res.body.flags).toEqual([]);
    expect(res.body.newCorrections).toEqual([
      expect.objectContaining({
        itemId: typo.id,
        itemNumber: 12,
        changes: { answer: { from: '1,138', to: '1,128' } },
        reason: 'The printed key had a typo in item 12',
        madeBy: expect.objectContaining({ name: 'Jules' }),
        remarkedSittingIds: [wrenSitting.id, miloSitting.id].sort((a, b) => a - b),
      }),
    ]);
    const bySitting = new Map(
      (res.body.remarkedSittings as { sittingId: number; newMissIds: number[] }[]).map((r) => [
        r.sittingId,
        r,
      ]),
    );
    expect(bySitting.get(wrenSitting.id)).toMatchObject({
      studentId: wren,
      before: { correct: 1, marked: 2 },
      after: { correct: 2, marked: 2 },
      resolvedMissIds: [wrenMiss],
      newMissIds: [],
    });
    const milo12 = bySitting.get(miloSitting.id)!;
    expect(milo12).toMatchObject({
      studentId: milo,
      before: { correct: 1, marked: 2 },
      after: { correct: 0, marked: 2 },
      resolvedMissIds: [],
    });
    expect(milo12.newMissIds).toHaveLength(1);

    const resolved = await owner.get(`/api/misses/${wrenMiss}`).expect(200);
    expect(resolved.body.status).toBe('resolved');
    expect(resolved.body.note).toContain('The printed key had a typo in item 12');
    const made = await owner.get(`/api/misses/${milo12.newMissIds[0]}`).expect(200);
    expect(made.body).toMatchObject({
      studentId: milo,
      sittingId: miloSitting.id,
      keyItemId: typo.id,
      problem: '47 x 24',
      answer: '1,138',
      status: 'logged',
      skills: ['partial products'],
      revisit: ['10', '11'],
      expected: '1128',
    });
    const miloNow = await owner.get(`/api/sittings/${miloSitting.id}`).expect(200);
    expect(miloNow.body.score).toMatchObject({ correct: 0, marked: 2, items: 2 });
    const history = await tutor.get(`/api/answer-keys/${key.id}`).expect(200);
    expect(history.body.corrections).toHaveLength(1);
  });

  it('saves a correction adding an item sent six times at once in turn, answering each', async () => {
    const key = await createKey({
      title: 'Worksheet 12',
      kind: 'worksheet',
      items: [
        { number: 1, prompt: '81 - 38', answer: '53' },
        { number: 2, prompt: '58 + 67', answer: '125' },
      ],
    });
    const [misprint, right] = key.items as [KeyJson['items'][0], KeyJson['items'][0]];
    const sitting = await markedSitting(milo, key.id, '2026-01-08T10:00', [
      { keyItemId: misprint.id, correct: true },
      { keyItemId: right.id, correct: true },
    ]);
    const correction = {
      reason: 'Item 1 was misprinted, and item 3 was left off',
      items: [
        { id: misprint.id, number: 1, prompt: '81 - 38', answer: '43' },
        { id: right.id, number: 2, prompt: '58 + 67', answer: '125' },
        { number: 3, prompt: '365 + 574', answer: '939' },
      ],
    };
    // On PostgreSQL, without the key's row lock, all but the first failed 409 on the items'
    // unique (key, number) index: each read the key's items before the others' item 3.
    const saves = await Promise.all(
      Array.from({ length: 6 }, () =>
        owner.send('patch', `/api/answer-keys/${key.id}`, correction),
      ),
    );
    expect(saves.map((r) => `${r.status} ${r.status === 200 ? '' : r.text}`)).toEqual(
      Array(6).fill('200 '),
    );
    type Correction = { itemNumber: number; changes: Record<string, unknown> };
    const made = saves.flatMap((r) => r.body.newCorrections as Correction[]);
    // One corrected item 1 and re-marked the sitting; the others found it corrected already…
    expect(made.filter((c) => 'answer' in c.changes)).toEqual([
      expect.objectContaining({ itemNumber: 1, changes: { answer: { from: '53', to: '43' } } }),
    ]);
    const remarked = saves.flatMap(
      (r) => r.body.remarkedSittings as { sittingId: number; newMissIds: number[] }[],
    );
    expect(remarked).toEqual([
      expect.objectContaining({
        sittingId: sitting.id,
        after: { correct: 1, marked: 2 },
        newMissIds: [expect.any(Number)],
      }),
    ]);
    // …and, as the same correction sent again in turn does, replaced item 3 (sent without an id).
    expect(made.filter((c) => 'removed' in c.changes).map((c) => c.itemNumber)).toEqual(
      Array(5).fill(3),
    );
    expect(made).toHaveLength(6);
    const now = await owner.get(`/api/answer-keys/${key.id}`).expect(200);
    expect(
      now.body.items.map((i: { number: number; answer: string }) => [i.number, i.answer]),
    ).toEqual([
      [1, '43'],
      [2, '125'],
      [3, '939'],
    ]);
    expect(now.body.corrections).toHaveLength(6);
    const score = await owner.get(`/api/sittings/${sitting.id}`).expect(200);
    expect(score.body.score).toMatchObject({ correct: 1, marked: 2, items: 3 });
  });

  it('refuses to remove an item that has marks, and keeps it', async () => {
    const key = await createKey({
      title: 'Worksheet 11',
      kind: 'worksheet',
      items: [
        { number: 1, prompt: '58 + 67', answer: '125' },
        { number: 2, prompt: '81 - 38', answer: '43' },
      ],
    });
    await markedSitting(wren, key.id, '2026-01-07T10:00', [
      { keyItemId: key.items[1]!.id, correct: true },
    ]);
    const res = await owner.send('patch', `/api/answer-keys/${key.id}`, {
      reason: 'shorter',
      items: [{ id: key.items[0]!.id, number: 1, prompt: '58 + 67', answer: '125' }],
    });
    expect(res.status).toBe(409);
    expect(res.body.message).toBe('item 2 has marks in sittings; correct it instead of removing');
    expect((await owner.get(`/api/answer-keys/${key.id}`)).body.items).toHaveLength(2);
  });
});

describe('who may', () => {
  it('lets a tutor read keys but not change them', async () => {
    const key = await createKey({ title: 'Tutor reads', kind: 'review', items: [] });
    await tutor.get('/api/answer-keys').expect(200);
    await tutor.get(`/api/answer-keys/${key.id}`).expect(200);
    await tutor.get(`/api/answer-keys/${key.id}/export.csv`).expect(200);
    expect(
      (await tutor.post('/api/answer-keys', { title: 'x', kind: 'review', items: [] })).status,
    ).toBe(403);
    expect((await tutor.send('patch', `/api/answer-keys/${key.id}`, { title: 'x' })).status).toBe(
      403,
    );
    expect((await tutor.send('delete', `/api/answer-keys/${key.id}`)).status).toBe(403);
  });

  it('answers 404 to another household', async () => {
    const key = await createKey({ title: 'Ours', kind: 'review', items: [] });
    await stranger.get(`/api/answer-keys/${key.id}`).expect(404);
    await stranger.get(`/api/answer-keys/${key.id}/export.csv`).expect(404);
    expect(
      (await stranger.send('patch', `/api/answer-keys/${key.id}`, { title: 'x' })).status,
    ).toBe(404);
    expect((await stranger.send('delete', `/api/answer-keys/${key.id}`)).status).toBe(404);
    const list = await stranger.get('/api/answer-keys').expect(200);
    expect(list.body.items.some((k: { id: number }) => k.id === key.id)).toBe(false);
  });
});
