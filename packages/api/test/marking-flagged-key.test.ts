import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signedIn, startTestApp, type Client, type TestApp } from './support/test-app.js';

// Issue 11 §5: when the checker flags a key's answer, a wrong mark on that item makes no miss
// until the parent says which answer is right. 304 − 75 = 229 and 58 + 67 = 125 (DESIGN.md's
// catalog examples); the key's 239 is a typo the checker flags.

let t: TestApp;
let owner: Client;
let student: number;
let keyId: number;
let items: { id: number; number: number; prompt: string; answer: string }[];

async function sitting(): Promise<number> {
  const res = await owner.post('/api/sittings', {
    studentId: student,
    answerKeyId: keyId,
    startedAt: '2026-11-30T09:30',
  });
  expect(res.status, res.text).toBe(201);
  return res.body.id as number;
}

const missesOf = async () =>
  (await owner.get(`/api/misses?studentId=${student}`).expect(200)).body.items as {
    problem: string;
    answer: string;
  }[];

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  student = (
    await owner.post('/api/students', { name: 'Marked child', gradeLevel: '3' }).expect(201)
  ).body.id as number;
  const key = await owner.post('/api/answer-keys', {
    title: 'Flagged key',
    kind: 'worksheet',
    items: [
      { number: 1, prompt: '304 - 75', answer: '239' },
      { number: 2, prompt: '58 + 67', answer: '125' },
    ],
  });
  expect(key.status, key.text).toBe(201);
  keyId = key.body.id as number;
  items = key.body.items;
  expect(key.body.flags.map((f: { number: number }) => f.number)).toEqual([1]);
});
afterAll(() => t.close());

describe('marking an item whose key answer is flagged', () => {
  it('makes no miss from it, says so, and makes the others', async () => {
    const id = await sitting();
    const res = await owner.send('put', `/api/sittings/${id}/marks`, {
      marks: [
        { keyItemId: items[0]!.id, correct: false, answer: '229' },
        { keyItemId: items[1]!.id, correct: false, answer: '115' },
      ],
    });
    expect(res.status, res.text).toBe(200);
    expect(res.body.misses.heldItemIds).toEqual([items[0]!.id]);
    expect(res.body.misses.createdMissIds).toHaveLength(1);
    expect(res.body.marks.map((m: { held: boolean }) => m.held)).toEqual([true, false]);
    expect((await missesOf()).map((m) => m.problem)).toEqual(['58 + 67']);
    // Saving the same marks again changes nothing.
    const again = await owner.send('put', `/api/sittings/${id}/marks`, {
      marks: [
        { keyItemId: items[0]!.id, correct: false, answer: '229' },
        { keyItemId: items[1]!.id, correct: false, answer: '115' },
      ],
    });
    expect(again.body.misses.createdMissIds).toEqual([]);
  });

  it('makes the miss once the parent says the key’s answer is right', async () => {
    const id = await sitting();
    await owner
      .send('put', `/api/sittings/${id}/marks`, {
        marks: [{ keyItemId: items[0]!.id, correct: false, answer: '249' }],
      })
      .expect(200);
    const res = await owner.send('put', `/api/sittings/${id}/marks`, {
      marks: [{ keyItemId: items[0]!.id, correct: false, answer: '249', keyAnswerRight: true }],
    });
    expect(res.status, res.text).toBe(200);
    expect(res.body.misses.createdMissIds).toHaveLength(1);
    expect(res.body.marks[0].held).toBe(false);
    expect((await missesOf()).map((m) => m.answer)).toContain('249');
  });

  it('names a bad keyAnswerRight', async () => {
    const id = await sitting();
    const res = await owner.send('put', `/api/sittings/${id}/marks`, {
      marks: [{ keyItemId: items[0]!.id, correct: false, keyAnswerRight: 'yes' }],
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fields)).toEqual(['marks.0.keyAnswerRight']);
  });

  it('when the key is corrected, re-marks: the child who wrote 229 was right after all', async () => {
    const before = (await missesOf()).length;
    const res = await owner.send('patch', `/api/answer-keys/${keyId}`, {
      reason: 'The key had a typo in item 1',
      items: [
        { id: items[0]!.id, number: 1, prompt: '304 - 75', answer: '229' },
        { id: items[1]!.id, number: 2, prompt: '58 + 67', answer: '125' },
      ],
    });
    expect(res.status, res.text).toBe(200);
    const list = await missesOf();
    // 229 is now right: still no miss for it. 249 stays wrong (its miss was made above).
    expect(list.filter((m) => m.answer === '229')).toEqual([]);
    expect(list.length).toBe(before);
  });
});
