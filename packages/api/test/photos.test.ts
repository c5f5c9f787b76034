import { existsSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PhotosService } from '../src/photos/photos.service.js';
import { db, fixture, photoFiles, postMultipart, studentIds, today } from './support/photos.js';
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
let wrenPhoto: number;
let miloPhoto: number;
let wrenMiss: number;

async function missWithPhoto(studentId: number) {
  const res = await postMultipart(
    owner,
    '/api/misses',
    { studentId, occurredOn: today(), problem: '81 - 38', answer: '57' },
    [{ name: 'p.png', data: fixture('sheet.png'), type: 'image/png' }],
  ).expect(201);
  return { miss: res.body.id as number, photo: res.body.photos[0].id as number };
}

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  tutor = await signedIn(t, DEMO.tutor);
  stranger = await registered(t, 'other@example.test', 'Other household');
  const ids = await studentIds(owner);
  const wren = await missWithPhoto(ids.get('Wren')!);
  wrenMiss = wren.miss;
  wrenPhoto = wren.photo;
  miloPhoto = (await missWithPhoto(ids.get('Milo')!)).photo;
});
afterAll(() => t.close());

describe('GET /api/photos/:id/image, /thumb and /small', () => {
  it.each(['image', 'thumb', 'small'])(
    'serves the %s privately with its real type',
    async (which) => {
      const res = await owner.get(`/api/photos/${wrenPhoto}/${which}`).buffer(true).expect(200);
      expect(res.headers['content-type']).toBe('image/jpeg');
      expect(res.headers['cache-control']).toBe('private, max-age=3600');
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      const meta = await sharp(res.body as Buffer).metadata();
      expect(meta.format).toBe('jpeg');
      expect(Number(res.headers['content-length'])).toBe((res.body as Buffer).length);
    },
  );

  it('serves a granted student’s photo to the tutor and 404s the rest', async () => {
    await tutor.get(`/api/photos/${wrenPhoto}/image`).expect(200);
    await tutor.get(`/api/photos/${miloPhoto}/image`).expect(404);
    await tutor.get(`/api/photos/${miloPhoto}/thumb`).expect(404);
    await stranger.get(`/api/photos/${wrenPhoto}/image`).expect(404);
    await stranger.get(`/api/photos/${wrenPhoto}/thumb`).expect(404);
    await tutor.get(`/api/photos/${miloPhoto}/small`).expect(404);
    await stranger.get(`/api/photos/${wrenPhoto}/small`).expect(404);
    await owner.get('/api/photos/999999/image').expect(404);
    await owner.get('/api/photos/999999/small').expect(404);
  });

  it('serves the list rows a 128 px square cut from the thumbnail, with no metadata', async () => {
    const res = await owner.get(`/api/photos/${wrenPhoto}/small`).buffer(true).expect(200);
    const meta = await sharp(res.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([128, 128]);
    expect(meta.exif).toBeUndefined();
    expect(meta.icc).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    const thumb = await owner.get(`/api/photos/${wrenPhoto}/thumb`).buffer(true).expect(200);
    expect((res.body as Buffer).length).toBeLessThan((thumb.body as Buffer).length);
  });

  it('makes the square of a photo saved before squares existed on first request, and keeps it', async () => {
    const { photo } = await missWithPhoto((await studentIds(owner)).get('Wren')!);
    const [row] = await db(t).query<{ storage_key: string }>(
      'SELECT storage_key FROM photos WHERE id = ?',
      { replacements: [photo], type: QueryTypes.SELECT },
    );
    const square = path.join(t.dataDir, 'photos', row!.storage_key.replace(/\.jpg$/, '-small.jpg'));
    // A photo from before: its display image and thumbnail only.
    rmSync(square);
    const res = await owner.get(`/api/photos/${photo}/small`).buffer(true).expect(200);
    expect(res.headers['cache-control']).toBe('private, max-age=3600');
    const meta = await sharp(res.body as Buffer).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['jpeg', 128, 128]);
    expect(readFileSync(square).equals(res.body as Buffer)).toBe(true);
    // Kept, and not taken for a file no row refers to.
    await t.app.get(PhotosService).sweepOrphans();
    expect(existsSync(square)).toBe(true);
  });

  it('exposes no photo folder: a stored file name is not a URL', async () => {
    const [name] = photoFiles(t);
    expect(name).toBeDefined();
    for (const url of [
      `/${name}`,
      `/photos/${name}`,
      `/api/photos/${name}`,
      `/data/photos/${name}`,
    ]) {
      const res = await owner.get(url);
      expect(res.headers['content-type'] ?? '').not.toMatch(/^image\//);
    }
  });
});

describe('PUT /api/photos/:id/marks', () => {
  it('replaces the pins and shows them on the miss', async () => {
    const first = await owner
      .send('put', `/api/photos/${wrenPhoto}/marks`, {
        marks: [
          { x: 0.25, y: 0.5, label: '  borrowed here ' },
          { x: 1, y: 0 },
        ],
      })
      .expect(200);
    expect(first.body.marks).toMatchObject([
      { x: 0.25, y: 0.5, label: 'borrowed here' },
      { x: 1, y: 0, label: null },
    ]);
    const second = await tutor
      .send('put', `/api/photos/${wrenPhoto}/marks`, { marks: [{ x: 0.6, y: 0.4, label: 'tens' }] })
      .expect(200);
    expect(second.body.marks).toMatchObject([{ x: 0.6, y: 0.4, label: 'tens' }]);
    const miss = await owner.get(`/api/misses/${wrenMiss}`).expect(200);
    expect(miss.body.photos[0].marks).toEqual(second.body.marks);
    await owner.send('put', `/api/photos/${wrenPhoto}/marks`, { marks: [] }).expect(200);
    const cleared = await owner.get(`/api/misses/${wrenMiss}`).expect(200);
    expect(cleared.body.photos[0].marks).toEqual([]);
  });

  it('saves the same pins sent six times at once once, answering each', async () => {
    const marks = [
      { x: 0.2, y: 0.3, label: 'carried' },
      { x: 0.7, y: 0.6 },
    ];
    const saved = [
      { x: 0.2, y: 0.3, label: 'carried' },
      { x: 0.7, y: 0.6, label: null },
    ];
    // On PostgreSQL, without the photo's row lock, each removed the pins there were before the
    // others committed and then added its own: every pin was saved six times.
    const saves = await Promise.all(
      Array.from({ length: 6 }, () =>
        owner.send('put', `/api/photos/${wrenPhoto}/marks`, { marks }),
      ),
    );
    expect(saves.map((r) => `${r.status} ${r.status === 200 ? '' : r.text}`)).toEqual(
      Array(6).fill('200 '),
    );
    for (const r of saves) expect(r.body.marks).toMatchObject(saved);
    const miss = await owner.get(`/api/misses/${wrenMiss}`).expect(200);
    expect(miss.body.photos[0].marks).toMatchObject(saved);
    const [rows] = await db(t).query(
      `SELECT COUNT(*) AS n FROM photo_marks WHERE photo_id = ${wrenPhoto}`,
    );
    expect(Number((rows as { n: number }[])[0]!.n)).toBe(2);
  });

  it.each([
    [{ marks: [{ x: 1.2, y: 0.5 }] }, 'marks.0.x'],
    [{ marks: [{ x: 0.5, y: -0.1 }] }, 'marks.0.y'],
    [{ marks: [{ x: '0.5', y: 0.5 }] }, 'marks.0.x'],
    [{ marks: [{ x: 0.5 }] }, 'marks.0.y'],
    [{ marks: [{ x: 0.5, y: 0.5, label: 'x'.repeat(41) }] }, 'marks.0.label'],
    [{ marks: Array.from({ length: 21 }, () => ({ x: 0.1, y: 0.1 })) }, 'marks'],
    [{ marks: 'here' }, 'marks'],
    [{}, 'marks'],
  ])('refuses %j naming %s and keeps the pins', async (body, field) => {
    await owner.send('put', `/api/photos/${wrenPhoto}/marks`, { marks: [{ x: 0.3, y: 0.3 }] });
    const res = await owner.send('put', `/api/photos/${wrenPhoto}/marks`, body).expect(400);
    expect(res.body.fields).toHaveProperty(field);
    const miss = await owner.get(`/api/misses/${wrenMiss}`).expect(200);
    expect(miss.body.photos[0].marks).toMatchObject([{ x: 0.3, y: 0.3 }]);
  });
});

describe('files no row refers to', () => {
  it('are swept (at start-up) after a student is deleted with its misses', async () => {
    const kid = await owner.post('/api/students', { name: 'Sweep', gradeLevel: '2' }).expect(201);
    const { photo } = await missWithPhoto(kid.body.id as number);
    const before = photoFiles(t);
    await owner.send('delete', `/api/students/${kid.body.id}`).expect(204);
    await owner.get(`/api/photos/${photo}/image`).expect(404);
    // The database cascade removes the rows; the files wait for the sweep PhotosModule runs at start-up.
    const removed = await t.app.get(PhotosService).sweepOrphans();
    expect(removed).toBe(3);
    expect(photoFiles(t)).toHaveLength(before.length - 3);
    await owner.get(`/api/photos/${wrenPhoto}/image`).expect(200);
  });
});
