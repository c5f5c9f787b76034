import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { studentIds, today } from './support/photos.js';
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
let wrenMiss: number;
let miloMiss: number;

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  tutor = await signedIn(t, DEMO.tutor);
  const ids = await studentIds(owner);
  const make = async (studentId: number) =>
    (
      await owner
        .post('/api/misses', { studentId, occurredOn: today(), problem: '52 - 27', answer: '35' })
        .expect(201)
    ).body.id as number;
  wrenMiss = await make(ids.get('Wren')!);
  miloMiss = await make(ids.get('Milo')!);
});
afterAll(() => t.close());

describe('notes on a miss', () => {
  it('lets the tutor and the parent write a thread, oldest first, with authors', async () => {
    const a = await tutor
      .post('/api/notes', { missId: wrenMiss, body: '  Same step as Tuesday.  ' })
      .expect(201);
    expect(a.body).toMatchObject({
      missId: wrenMiss,
      body: 'Same step as Tuesday.',
      author: { displayName: 'Pat (tutor)' },
    });
    await owner.post('/api/notes', { missId: wrenMiss, body: 'We will use blocks.' }).expect(201);
    const thread = await tutor.get(`/api/notes?missId=${wrenMiss}`).expect(200);
    expect(thread.body.total).toBe(2);
    expect(thread.body.items.map((n: { body: string }) => n.body)).toEqual([
      'Same step as Tuesday.',
      'We will use blocks.',
    ]);
  });

  it('keeps the tutor to granted students and other households out', async () => {
    await tutor.post('/api/notes', { missId: miloMiss, body: 'hello' }).expect(404);
    await tutor.get(`/api/notes?missId=${miloMiss}`).expect(404);
    await owner.post('/api/notes', { missId: miloMiss, body: 'Milo note' }).expect(201);
    const all = await tutor.get('/api/notes').expect(200);
    expect(all.body.items.every((n: { missId: number }) => n.missId !== miloMiss)).toBe(true);
    const stranger = await registered(t, 'nosy@example.test', 'Nosy household');
    await stranger.post('/api/notes', { missId: wrenMiss, body: 'hi' }).expect(404);
    const theirs = await stranger.get('/api/notes').expect(200);
    expect(theirs.body).toMatchObject({ items: [], total: 0 });
  });

  it.each([
    [{ missId: 0, body: 'x' }, 'missId'],
    [{ body: 'x' }, 'missId'],
    [{ missId: 1, body: '   ' }, 'body'],
    [{ missId: 1, body: 'x'.repeat(2001) }, 'body'],
    [{ missId: 1, body: 'x', author: 3 }, 'author'],
  ])('refuses %j naming %s', async (body, field) => {
    const res = await owner.post('/api/notes', body).expect(400);
    expect(res.body.fields).toHaveProperty(field);
  });

  it('removes the notes with their miss', async () => {
    const id = (
      await owner
        .post('/api/misses', {
          studentId: (await studentIds(owner)).get('Wren'),
          occurredOn: today(),
          problem: '9 + 7',
          answer: '15',
        })
        .expect(201)
    ).body.id as number;
    await owner.post('/api/notes', { missId: id, body: 'gone soon' }).expect(201);
    await owner.send('delete', `/api/misses/${id}`).expect(204);
    await owner.get(`/api/notes?missId=${id}`).expect(404);
    const all = await owner.get('/api/notes?pageSize=100').expect(200);
    expect(all.body.items.some((n: { body: string }) => n.body === 'gone soon')).toBe(false);
  });
});
