import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeS3, type FakeS3 } from './support/fake-s3.js';
import { fixture, photoFiles, postMultipart, studentIds, today } from './support/photos.js';
import { readZip } from './support/zip.js';
import {
  type Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

// Photos in an S3-compatible bucket (S3_*): the AWS SDK client against s3rver, a local fake S3.
let s3: FakeS3;
let t: TestApp;
let owner: Client;
let tutor: Client;
let stranger: Client;

beforeAll(async () => {
  s3 = await startFakeS3();
  // Seeded afresh, so the demo household's photos are in the bucket too.
  t = await startTestApp({ ...s3.env, SEED_FRESH: 'true', SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  tutor = await signedIn(t, DEMO.tutor);
  stranger = await registered(t, 'bucket-stranger@example.test', 'Other household');
});
afterAll(async () => {
  await t?.close();
  await s3?.close();
});

async function missWithPhoto(studentId: number) {
  const res = await postMultipart(
    owner,
    '/api/misses',
    { studentId, occurredOn: today(), problem: '81 - 38', answer: '57' },
    [{ name: 'p.png', data: fixture('sheet.png'), type: 'image/png' }],
  );
  expect(res.status, res.text).toBe(201);
  return res.body as { id: number; photos: { id: number }[] };
}

describe('photos on S3-compatible storage', () => {
  it('writes the photo and its thumbnail to the bucket, nothing to the data folder', async () => {
    const before = new Set(await s3.keys());
    const ids = await studentIds(owner);
    await missWithPhoto(ids.get('Wren')!);
    const added = (await s3.keys()).filter((k) => !before.has(k));
    expect(added).toHaveLength(3);
    for (const key of added) expect(key).toMatch(/^[0-9a-f-]{36}(-thumb|-small)?\.jpg$/);
    expect(photoFiles(t)).toEqual([]);
  });

  it('serves photos through the app with the same headers and scoping', async () => {
    const ids = await studentIds(owner);
    const wren = (await missWithPhoto(ids.get('Wren')!)).photos[0]!.id;
    const milo = (await missWithPhoto(ids.get('Milo')!)).photos[0]!.id;
    for (const which of ['image', 'thumb', 'small']) {
      const res = await owner.get(`/api/photos/${wren}/${which}`).buffer(true).expect(200);
      expect(res.headers['content-type']).toBe('image/jpeg');
      expect(res.headers['cache-control']).toBe('private, max-age=3600');
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect((await sharp(res.body as Buffer).metadata()).format).toBe('jpeg');
    }
    await tutor.get(`/api/photos/${wren}/image`).expect(200);
    await tutor.get(`/api/photos/${milo}/image`).expect(404);
    await stranger.get(`/api/photos/${wren}/image`).expect(404);
  });

  it('removes the objects with the photo', async () => {
    const ids = await studentIds(owner);
    const before = new Set(await s3.keys());
    const miss = await missWithPhoto(ids.get('Wren')!);
    expect((await s3.keys()).length).toBe(before.size + 3);
    await owner.send('delete', `/api/photos/${miss.photos[0]!.id}`).expect(204);
    expect(await s3.keys()).toEqual([...before].sort());
  });

  it('puts the household’s photos from the bucket into the export', async () => {
    const res = await owner
      .get('/api/export')
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    const files = readZip(res.body as Buffer);
    const photos = JSON.parse(files.get('tables/photos.json')!.toString()) as {
      storage_key: string;
      thumb_key: string;
    }[];
    expect(photos.length).toBeGreaterThan(0);
    const stored = new Set(await s3.keys());
    for (const p of photos) {
      for (const key of [p.storage_key, p.thumb_key]) {
        expect(stored.has(key), key).toBe(true);
        expect(files.get(`photos/${key}`)?.length, key).toBeGreaterThan(0);
      }
    }
  });
});
