import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fixture, postMultipart, studentIds, today } from './support/photos.js';
import { type Client, DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

// Notebook pages are kept between reads on SQLite (misses/page-cache.ts). Each write below is
// followed by the same read a parent's phone makes again, which must show the write at once.
let t: TestApp;
let owner: Client;
let coparent: Client;
let tutor: Client;
let wren: number;

type Item = { id: number; problem: string; note: string | null; photoCount: number };
async function firstPage(client: Client, query = ''): Promise<{ items: Item[]; total: number }> {
  return (await client.get(`/api/misses?page=1${query}`).expect(200)).body;
}

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  coparent = await signedIn(t, DEMO.parent);
  tutor = await signedIn(t, DEMO.tutor);
  wren = (await studentIds(owner)).get('Wren')!;
}, 120_000);
afterAll(() => t.close());

describe('a notebook page read again after a write', () => {
  it('shows a miss logged by another parent of the household', async () => {
    const before = await firstPage(owner);
    const created = await coparent
      .post('/api/misses', {
        studentId: wren,
        occurredOn: today(),
        problem: '602 - 48',
        answer: '664',
      })
      .expect(201);
    const after = await firstPage(owner);
    expect(after.items[0]!.id).toBe(created.body.id);
    expect(after.total).toBe(before.total + 1);
  });

  it('shows an edit, a photo added and taken away, and a miss deleted', async () => {
    const id = (await firstPage(owner)).items[0]!.id;
    await coparent.send('patch', `/api/misses/${id}`, { note: 'talked it through' }).expect(200);
    expect((await firstPage(owner)).items[0]).toMatchObject({ id, note: 'talked it through' });

    const added = await postMultipart(coparent, `/api/misses/${id}/photos`, {}, [
      { name: 'p.png', data: fixture('sheet.png'), type: 'image/png' },
    ]).expect(201);
    expect((await firstPage(owner)).items[0]).toMatchObject({ id, photoCount: 1 });
    const photoId = (added.body.photos as { id: number }[])[0]!.id;
    await coparent.send('delete', `/api/photos/${photoId}`).expect(204);
    expect((await firstPage(owner)).items[0]).toMatchObject({ id, photoCount: 0 });

    await coparent.send('delete', `/api/misses/${id}`).expect(204);
    expect((await firstPage(owner)).items.map((m) => m.id)).not.toContain(id);
  });

  it('keeps each member to what they may see, filters apart', async () => {
    const all = await firstPage(owner);
    const wrens = await firstPage(owner, `&studentId=${wren}`);
    const tutors = await firstPage(tutor);
    expect(wrens.total).toBeLessThan(all.total);
    // The tutor sees the granted child only, though the owner's page of the same household
    // and filter was read just before.
    expect(tutors.total).toBe(wrens.total);
  });
});
