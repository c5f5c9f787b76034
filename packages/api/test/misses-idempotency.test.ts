import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fixture, footprint, postMultipart, studentIds, today } from './support/photos.js';
import {
  type Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

// A draft kept on the phone while offline is sent again until an answer arrives; the
// Idempotency-Key it carries must make exactly one miss however often it arrives.

let t: TestApp;
let owner: Client;
let coparent: Client;
let stranger: Client;
let wren: number;
let strangerChild: number;

const photo = () => [{ name: 'sheet.png', data: fixture('sheet.png'), type: 'image/png' }];

function post(client: Client, key: string | null, fields: Record<string, string | number>) {
  const req = postMultipart(client, '/api/misses', fields, photo());
  return key === null ? req : req.set('Idempotency-Key', key);
}

const fields = (studentId: number, problem = '304 - 75') => ({
  studentId,
  occurredOn: today(),
  problem,
  answer: '371',
  explanation: 'I took the small from the big',
});

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  coparent = await signedIn(t, DEMO.parent);
  stranger = await registered(t, 'idempotent@example.test', 'Another household');
  wren = (await studentIds(owner)).get('Wren')!;
  strangerChild = (
    await stranger.post('/api/students', { name: 'Ash', gradeLevel: '3' }).expect(201)
  ).body.id as number;
});
afterAll(() => t.close());

describe('POST /api/misses with an Idempotency-Key', () => {
  it('makes one miss (and one photo) however often the same request arrives', async () => {
    const before = await footprint(t);
    const key = 'draft-0d4c2f7e-1111-4a5b-9c3d-000000000001';
    const first = await post(owner, key, fields(wren)).expect(201);
    const again = await post(owner, key, fields(wren)).expect(200);
    // Another parent of the same household sending the same draft meets the same miss.
    const third = await post(coparent, key, fields(wren)).expect(200);
    expect(again.body.id).toBe(first.body.id);
    expect(third.body.id).toBe(first.body.id);
    expect(again.body.photos).toHaveLength(1);
    expect(again.body.photos[0].id).toBe(first.body.photos[0].id);
    const after = await footprint(t);
    expect(after.misses).toBe(before.misses + 1);
    expect(after.photos).toBe(before.photos + 1);
    // Kept: one display image, one thumbnail and one small square for the one photo, no copies.
    expect(after.files.length - before.files.length).toBe(3);
  });

  it('makes one miss when two copies race', async () => {
    const before = await footprint(t);
    const key = 'draft-0d4c2f7e-1111-4a5b-9c3d-000000000002';
    const [a, b] = await Promise.all([
      post(owner, key, fields(wren, '27 x 4')),
      post(owner, key, fields(wren, '27 x 4')),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(a.body.id).toBe(b.body.id);
    const after = await footprint(t);
    expect(after.misses).toBe(before.misses + 1);
    expect(after.files.length - before.files.length).toBe(3);
  });

  it('refuses the key reused for other content with 409, writing nothing', async () => {
    const key = 'draft-0d4c2f7e-1111-4a5b-9c3d-000000000003';
    const first = await post(owner, key, fields(wren, '612 ÷ 6')).expect(201);
    const before = await footprint(t);
    const res = await post(owner, key, fields(wren, '612 ÷ 3')).expect(409);
    expect(res.body.fields).toHaveProperty('idempotency-key');
    expect(res.body.message).toMatch(/Idempotency-Key/);
    expect(await footprint(t)).toEqual(before);
    // The first miss is untouched.
    const kept = await owner.get(`/api/misses/${first.body.id}`).expect(200);
    expect(kept.body.problem).toBe('612 ÷ 6');
  });

  it('scopes the key to the household: another household’s same key makes its own miss', async () => {
    const key = 'draft-0d4c2f7e-1111-4a5b-9c3d-000000000004';
    const ours = await post(owner, key, fields(wren, '81 - 38')).expect(201);
    const theirs = await post(stranger, key, fields(strangerChild, '81 - 38')).expect(201);
    expect(theirs.body.id).not.toBe(ours.body.id);
    expect(theirs.body.studentId).toBe(strangerChild);
    // Neither can reach the other's miss through the key.
    await stranger.get(`/api/misses/${ours.body.id}`).expect(404);
  });

  it('answers a malformed key with 400 naming it, writing nothing', async () => {
    const before = await footprint(t);
    for (const key of [
      'short',
      'has spaces in it, sixteen+',
      'x'.repeat(101),
      'key/with/slashes/0123456789',
    ]) {
      const res = await post(owner, key, fields(wren)).expect(400);
      expect(res.body.fields).toHaveProperty('idempotency-key');
    }
    expect(await footprint(t)).toEqual(before);
  });

  it('keeps saving a new miss per request when no key is sent', async () => {
    const before = await footprint(t);
    const a = await post(owner, null, fields(wren, '45 + 38')).expect(201);
    const b = await post(owner, null, fields(wren, '45 + 38')).expect(201);
    expect(a.body.id).not.toBe(b.body.id);
    expect((await footprint(t)).misses).toBe(before.misses + 2);
  });
});
