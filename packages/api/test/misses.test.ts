import exifr from 'exifr';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { PHOTO_STORAGE, type PhotoStorage } from '../src/storage/photo-storage.js';
import {
  db,
  fixture,
  footprint,
  photoFiles,
  postMultipart,
  studentIds,
  today,
} from './support/photos.js';
import { type Client, DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

let t: TestApp;
let owner: Client;
let wren: number;
let milo: number;

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  const ids = await studentIds(owner);
  wren = ids.get('Wren')!;
  milo = ids.get('Milo')!;
});
afterAll(() => t.close());

const fields = (over: Record<string, string | number> = {}) => ({
  studentId: wren,
  occurredOn: today(),
  problem: '304 - 75',
  answer: '139',
  explanation: 'I took one from the 3 because the zero had nothing.',
  cause: 'step',
  ...over,
});

const jpeg = () => ({ name: 'work.jpg', data: fixture('sheet.png'), type: 'image/png' });

describe('POST /api/misses', () => {
  it.each([
    ['JPEG', 'rotated-gps.jpg', 'image/jpeg'],
    ['PNG', 'sheet.png', 'image/png'],
    ['WebP', 'sheet.webp', 'image/webp'],
  ])(
    'saves a miss with a %s photo, its diagnosis and the photo size',
    async (_kind, name, type) => {
      const res = await postMultipart(owner, '/api/misses', fields(), [
        { name, data: fixture(name), type },
      ]);
      expect(res.status, res.text).toBe(201);
      expect(res.body).toMatchObject({
        studentId: wren,
        problem: '304 - 75',
        answer: '139',
        cause: 'step',
        status: 'logged',
        checked: true,
      });
      // 304 − 75 = 229 by plain arithmetic; the answer 139 is the "borrow across zero" bug
      // (Brown & Burton 1978, BORROW-ACROSS-ZERO; from memory).
      expect(res.body.expected).toBe(String(304 - 75));
      expect(res.body.diagnosis.expected).toBe('229');
      expect(res.body.diagnosis.rules[0].id).toBe('sub.borrow-across-zero');
      expect(res.body.ruleIds).toContain('sub.borrow-across-zero');
      expect(res.body.engineVersion).toBe(res.body.diagnosis.engineVersion);
      expect(res.body.photos).toHaveLength(1);
      expect(res.body.photos[0]).toMatchObject({
        id: expect.any(Number),
        contentType: 'image/jpeg',
      });
      expect(res.body.thumbnailPhotoId).toBe(res.body.photos[0].id);
    },
  );

  it('turns the rotated, GPS-tagged JPEG upright and strips every bit of metadata', async () => {
    const original = fixture('rotated-gps.jpg');
    // The fixture really carries what must go (exifr is the reference EXIF reader).
    expect(await exifr.gps(original)).toMatchObject({ latitude: expect.any(Number) });
    expect((await exifr.parse(original)).Make).toBe('Invented Camera Co');
    const stored = await sharp(original).metadata();
    expect([stored.width, stored.height, stored.orientation]).toEqual([600, 400, 6]);

    const res = await postMultipart(owner, '/api/misses', fields(), [
      { name: 'IMG_0001.jpg', data: original },
    ]);
    expect(res.status, res.text).toBe(201);
    const photo = res.body.photos[0];
    expect([photo.width, photo.height]).toEqual([400, 600]);

    for (const url of [`/api/photos/${photo.id}/image`, `/api/photos/${photo.id}/thumb`]) {
      const served = await owner.get(url).buffer(true).expect(200);
      const body = served.body as Buffer;
      expect(await exifr.parse(body, true)).toBeUndefined();
      expect(await exifr.gps(body)).toBeUndefined();
      const meta = await sharp(body).metadata();
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.icc).toBeUndefined();
      expect(meta.orientation).toBeUndefined();
      expect(meta.height).toBeGreaterThan(meta.width!);
      // The dark block drawn top-left in the stored (sideways) image is top-right once upright.
      const { data, info } = await sharp(body).raw().toBuffer({ resolveWithObject: true });
      const at = (x: number, y: number) => data[(y * info.width + x) * info.channels]!;
      expect(at(info.width - 5, 5)).toBeLessThan(80);
      expect(at(5, 5)).toBeGreaterThan(180);
    }
  });

  it('keeps a display image of at most 2048 px and a 400 px thumbnail', async () => {
    const big = await sharp({
      create: { width: 3000, height: 2000, channels: 3, background: '#dde4ee' },
    })
      .jpeg()
      .toBuffer();
    const res = await postMultipart(owner, '/api/misses', fields(), [
      { name: 'big.jpg', data: big },
    ]);
    expect(res.status, res.text).toBe(201);
    const photo = res.body.photos[0];
    expect([photo.width, photo.height]).toEqual([2048, 1365]);
    expect(photo.thumbWidth).toBe(400);
    expect(Math.abs(photo.thumbHeight - (400 * 2000) / 3000)).toBeLessThanOrEqual(1);
    const thumb = await owner.get(`/api/photos/${photo.id}/thumb`).buffer(true).expect(200);
    const meta = await sharp(thumb.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([photo.thumbWidth, photo.thumbHeight]);
  });

  it('stores files under server-made names, readable by the server only', async () => {
    const before = new Set(photoFiles(t));
    const res = await postMultipart(owner, '/api/misses', fields(), [
      { name: 'wren-homework.jpg', data: fixture('sheet.png'), type: 'image/png' },
    ]);
    expect(res.status).toBe(201);
    const added = photoFiles(t).filter((f) => !before.has(f));
    // The display image, its thumbnail and the list rows' small square.
    expect(added).toHaveLength(3);
    for (const name of added) {
      expect(name).toMatch(/^[0-9a-f-]{36}(-thumb|-small)?\.jpg$/);
      const { statSync } = await import('node:fs');
      const mode = statSync(`${t.dataDir}/photos/${name}`).mode & 0o777;
      expect(mode).toBe(0o600);
    }
  });

  it('saves a miss without photos, and a problem the checkers cannot read as "not checked"', async () => {
    const res = await owner.post('/api/misses', {
      studentId: milo,
      occurredOn: today(),
      problem: 'A ribbon is 3 m long. How many 50 cm pieces can be cut from it?',
      answer: '5',
      explanation: 'I did 3 and 50 and it was more.',
      cause: 'reading',
    });
    expect(res.status, res.text).toBe(201);
    expect(res.body).toMatchObject({
      checked: false,
      diagnosis: null,
      engineVersion: null,
      ruleIds: [],
      cause: 'reading',
      photos: [],
      thumbnailPhotoId: null,
    });
    expect(res.body.notCheckedReason).toEqual(expect.any(String));
  });

  it('keeps the child’s words verbatim and fills defaults for cause and status', async () => {
    const words = 'umm i took 5 from 8?? then — carried the 1 🙂';
    const res = await owner.post('/api/misses', {
      studentId: wren,
      occurredOn: today(),
      problem: '58 + 67',
      answer: '115',
      explanation: words,
    });
    expect(res.status, res.text).toBe(201);
    expect(res.body).toMatchObject({ explanation: words, cause: 'unsure', status: 'logged' });
    expect(res.body.suggestedCause).toBe('step');
  });

  it('reads written steps sent as JSON text in a multipart form', async () => {
    const res = await postMultipart(
      owner,
      '/api/misses',
      fields({
        problem: '34 x 12',
        answer: '102',
        steps: JSON.stringify({ partials: ['68', '34'] }),
      }),
    );
    expect(res.status, res.text).toBe(201);
    expect(res.body.steps).toEqual({ partials: ['68', '34'] });
    // The stored diagnosis draws them beside the usual ones and marks the first that differs:
    // 34 × 2 = 68 and 34 × 10 = 340 (worked by hand; issue 11 §1).
    expect(res.body.diagnosis.writtenSteps).toMatchObject({
      kind: 'partials',
      firstDiffers: 1,
      steps: [
        { written: '68', expected: String(34 * 2), ok: true },
        { written: '34', expected: String(34 * 10), ok: false },
      ],
    });
    const stored = await owner.get(`/api/misses/${res.body.id}`).expect(200);
    expect(stored.body.diagnosis.writtenSteps).toEqual(res.body.diagnosis.writtenSteps);
  });

  describe('refuses bad input with nothing left behind', () => {
    const refusals: [
      string,
      () => Promise<{ status: number; body: Record<string, unknown> }>,
      number,
      RegExp | string,
    ][] = [
      [
        'an 11 MiB photo',
        () => {
          const data = Buffer.alloc(11 * 1024 * 1024, 0x20);
          fixture('rotated-gps.jpg').copy(data);
          return postMultipart(owner, '/api/misses', fields(), [{ name: 'huge.jpg', data }]);
        },
        413,
        /10 MiB/,
      ],
      [
        'a text file named .jpg',
        () =>
          postMultipart(owner, '/api/misses', fields(), [
            { name: 'photo.jpg', data: fixture('not-an-image.jpg') },
          ]),
        415,
        /JPEG, PNG or WebP/,
      ],
      [
        'a HEIC photo this server cannot read',
        () =>
          postMultipart(owner, '/api/misses', fields(), [
            { name: 'IMG.heic', data: fixture('header-only.heic'), type: 'image/heic' },
          ]),
        415,
        /HEIC.*JPEG, PNG or WebP/,
      ],
      [
        'a truncated JPEG',
        () =>
          postMultipart(owner, '/api/misses', fields(), [
            { name: 'cut.jpg', data: fixture('truncated.jpg') },
          ]),
        422,
        /damaged or incomplete/,
      ],
      [
        'a 20000×20000 PNG',
        () =>
          postMultipart(owner, '/api/misses', fields(), [
            { name: 'bomb.png', data: fixture('bomb-20000.png'), type: 'image/png' },
          ]),
        422,
        /too many pixels/,
      ],
      [
        'a good photo after a bad one (the whole request fails)',
        () =>
          postMultipart(owner, '/api/misses', fields(), [
            jpeg(),
            { name: 'cut.jpg', data: fixture('truncated.jpg') },
          ]),
        422,
        /photo 2/,
      ],
      [
        'five photos',
        () =>
          postMultipart(owner, '/api/misses', fields(), [jpeg(), jpeg(), jpeg(), jpeg(), jpeg()]),
        400,
        /at most 4 photos/,
      ],
      [
        'a file under another field name',
        () =>
          owner.agent
            .post('/api/misses')
            .set('x-csrf-token', owner.token)
            .field('studentId', String(wren))
            .attach('picture', fixture('sheet.png'), 'a.png'),
        400,
        /picture/,
      ],
      [
        'a missing problem',
        () => postMultipart(owner, '/api/misses', fields({ problem: '' }), [jpeg()]),
        400,
        /problem/,
      ],
      [
        'a date that does not exist',
        () => postMultipart(owner, '/api/misses', fields({ occurredOn: '2026-02-30' }), [jpeg()]),
        400,
        /occurredOn/,
      ],
      [
        'a cause not on the list',
        () => postMultipart(owner, '/api/misses', fields({ cause: 'lazy' }), [jpeg()]),
        400,
        /cause must be one of slip, fact, concept, step, reading, copying, unsure/,
      ],
      [
        'steps that are not JSON',
        () => postMultipart(owner, '/api/misses', fields({ steps: '{partials:' }), [jpeg()]),
        400,
        /steps/,
      ],
      [
        'steps the engine cannot read',
        () =>
          postMultipart(owner, '/api/misses', fields({ steps: '{"partials":["six"]}' }), [jpeg()]),
        400,
        /steps/,
      ],
      [
        'a field we do not take',
        () => postMultipart(owner, '/api/misses', fields({ grade: 'F' }), [jpeg()]),
        400,
        /grade/,
      ],
      [
        'skills that are not a list',
        () => postMultipart(owner, '/api/misses', fields({ skills: 'regrouping' }), [jpeg()]),
        400,
        /skills/,
      ],
    ];

    it.each(refusals)('%s', async (_name, send, status, message) => {
      const before = await footprint(t);
      const res = await send();
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      expect(res.body.statusCode).toBe(status);
      expect(String(res.body.message)).toMatch(message);
      if (status === 400) expect(res.body.fields).toBeTypeOf('object');
      expect(await footprint(t)).toEqual(before);
    });

    it('answers 404 for another household’s or an unknown student', async () => {
      const before = await footprint(t);
      const res = await postMultipart(owner, '/api/misses', fields({ studentId: 999_999 }), [
        jpeg(),
      ]);
      expect(res.status).toBe(404);
      expect(await footprint(t)).toEqual(before);
    });

    it('answers 404 for an unknown student before refusing its photo', async () => {
      // The student is looked up while the photo is decoded; the student's answer comes first.
      const before = await footprint(t);
      const res = await postMultipart(owner, '/api/misses', fields({ studentId: 999_999 }), [
        { name: 'cut.jpg', data: fixture('truncated.jpg') },
      ]);
      expect(res.status, JSON.stringify(res.body)).toBe(404);
      expect(await footprint(t)).toEqual(before);
    });
  });

  describe('fails whole when a step fails', () => {
    it('removes the files already written when writing a later one fails', async () => {
      const storage = t.app.get<PhotoStorage>(PHOTO_STORAGE);
      const real = storage.put.bind(storage);
      let calls = 0;
      const spy = vi.spyOn(storage, 'put').mockImplementation(async (key, data) => {
        calls++;
        if (calls === 3) throw new Error('disk went away');
        return real(key, data);
      });
      try {
        const before = await footprint(t);
        const res = await postMultipart(owner, '/api/misses', fields(), [jpeg(), jpeg()]);
        expect(res.status).toBe(500);
        expect(res.body.message).toMatch(/nothing was saved/);
        expect(calls).toBe(3);
        expect(await footprint(t)).toEqual(before);
      } finally {
        spy.mockRestore();
      }
    });

    it('answers 507 when the disk is full, leaving nothing', async () => {
      const storage = t.app.get<PhotoStorage>(PHOTO_STORAGE);
      const spy = vi
        .spyOn(storage, 'put')
        .mockRejectedValue(Object.assign(new Error('no space left on device'), { code: 'ENOSPC' }));
      try {
        const before = await footprint(t);
        const res = await postMultipart(owner, '/api/misses', fields(), [jpeg()]);
        expect(res.status).toBe(507);
        expect(await footprint(t)).toEqual(before);
      } finally {
        spy.mockRestore();
      }
    });

    it.each(['misses', 'miss_diagnoses', 'miss_rules', 'photos'])(
      'rolls back the rows and removes the files when inserting into %s fails',
      async (table) => {
        const sequelize = db(t);
        const postgres = sequelize.getDialect() === 'postgres';
        if (postgres) {
          await sequelize.query(
            `CREATE FUNCTION fail_insert() RETURNS trigger LANGUAGE plpgsql AS $$
             BEGIN RAISE EXCEPTION 'test failure'; END $$`,
          );
          await sequelize.query(
            `CREATE TRIGGER fail_insert BEFORE INSERT ON ${table} FOR EACH ROW EXECUTE FUNCTION fail_insert()`,
          );
        } else {
          await sequelize.query(
            `CREATE TRIGGER fail_insert BEFORE INSERT ON ${table} BEGIN SELECT RAISE(ABORT, 'test failure'); END`,
          );
        }
        try {
          const before = await footprint(t);
          const res = await postMultipart(owner, '/api/misses', fields(), [jpeg(), jpeg()]);
          // SQLite reports a trigger's abort as a constraint failure, which the error filter answers 409.
          expect(res.status).toBeGreaterThanOrEqual(409);
          expect(await footprint(t)).toEqual(before);
        } finally {
          await sequelize.query(
            postgres ? `DROP TRIGGER fail_insert ON ${table}` : 'DROP TRIGGER fail_insert',
          );
          if (postgres) await sequelize.query('DROP FUNCTION fail_insert');
        }
      },
    );
  });
});

describe('GET /api/misses/:id', () => {
  it('answers the miss with its photos and 404 for an id that is not there', async () => {
    const created = await postMultipart(owner, '/api/misses', fields(), [jpeg()]).expect(201);
    const res = await owner.get(`/api/misses/${created.body.id}`).expect(200);
    expect(res.body).toEqual(created.body);
    await owner.get('/api/misses/999999').expect(404);
    const bad = await owner.get('/api/misses/abc').expect(400);
    expect(bad.body.fields).toHaveProperty('id');
  });
});

describe('PATCH /api/misses/:id', () => {
  it('re-runs the diagnosis when the answer changes and keeps rule filters in step', async () => {
    const created = await owner
      .post('/api/misses', {
        studentId: wren,
        occurredOn: today(),
        problem: '81 - 38',
        answer: '57',
      })
      .expect(201);
    // 81 − 38 written 57: SMALLER-FROM-LARGER (Brown & Burton 1978; from memory).
    expect(created.body.ruleIds[0]).toBe('sub.smaller-from-larger');
    const id = created.body.id as number;
    const patched = await owner
      .send('patch', `/api/misses/${id}`, { answer: '53', cause: 'step', status: 'discussed' })
      .expect(200);
    // 53 is what taking ten without reducing the tens gives: BORROW-NO-DECREMENT (Brown & Burton 1978; from memory).
    expect(patched.body.ruleIds[0]).toBe('sub.borrow-no-decrement');
    expect(patched.body).toMatchObject({ answer: '53', cause: 'step', status: 'discussed' });
    const byOld = await owner
      .get('/api/misses?rule=sub.smaller-from-larger&pageSize=100')
      .expect(200);
    expect(byOld.body.items.map((m: { id: number }) => m.id)).not.toContain(id);
    const byNew = await owner
      .get('/api/misses?rule=sub.borrow-no-decrement&pageSize=100')
      .expect(200);
    expect(byNew.body.items.map((m: { id: number }) => m.id)).toContain(id);
  });

  it('stores "not checked" when an edit makes the problem unreadable, and back again', async () => {
    const created = await owner
      .post('/api/misses', {
        studentId: wren,
        occurredOn: today(),
        problem: '81 - 38',
        answer: '57',
      })
      .expect(201);
    const id = created.body.id as number;
    const words = await owner
      .send('patch', `/api/misses/${id}`, { problem: 'How many legs do 3 stools have?' })
      .expect(200);
    expect(words.body).toMatchObject({ checked: false, diagnosis: null, ruleIds: [] });
    const back = await owner.send('patch', `/api/misses/${id}`, { problem: '81 - 38' }).expect(200);
    expect(back.body.checked).toBe(true);
  });

  it('leaves the diagnosis alone for a status-only change, and refuses null or bad values', async () => {
    const created = await owner
      .post('/api/misses', {
        studentId: wren,
        occurredOn: today(),
        problem: '81 - 38',
        answer: '57',
      })
      .expect(201);
    const id = created.body.id as number;
    const res = await owner.send('patch', `/api/misses/${id}`, { status: 'resolved' }).expect(200);
    expect(res.body.diagnosis).toEqual(created.body.diagnosis);
    for (const body of [
      { cause: null },
      { status: 'done' },
      { problem: '' },
      { studentId: 999_999 },
    ]) {
      const bad = await owner.send('patch', `/api/misses/${id}`, body);
      expect([400, 404], JSON.stringify(body)).toContain(bad.status);
    }
    const nullCause = await owner.send('patch', `/api/misses/${id}`, { cause: null }).expect(400);
    expect(nullCause.body.fields).toHaveProperty('cause');
    const after = await owner.get(`/api/misses/${id}`).expect(200);
    expect(after.body).toMatchObject({ status: 'resolved', cause: 'unsure', problem: '81 - 38' });
  });

  it('saves the same written steps sent five times at once, answering each', async () => {
    const steps = { partials: ['68', '34'] };
    const created = await owner
      .post('/api/misses', { ...fields({ problem: '34 x 12', answer: '102' }), steps })
      .expect(201);
    const id = created.body.id as number;
    // The same steps change no column of the miss, so its UPDATE locks nothing: on PostgreSQL,
    // without the miss's row lock, the later ones each removed the diagnosis and rule rows
    // before the first committed, then inserted them again into its primary keys (409).
    const saves = await Promise.all(
      Array.from({ length: 5 }, () => owner.send('patch', `/api/misses/${id}`, { steps })),
    );
    expect(saves.map((r) => `${r.status} ${r.status === 200 ? '' : r.text}`)).toEqual(
      Array(5).fill('200 '),
    );
    for (const r of saves) expect(r.body.diagnosis).toEqual(created.body.diagnosis);
    const after = await owner.get(`/api/misses/${id}`).expect(200);
    expect(after.body).toMatchObject({ steps, ruleIds: created.body.ruleIds });
    const [rows] = await db(t).query(
      `SELECT (SELECT COUNT(*) FROM miss_diagnoses WHERE miss_id = ${id}) AS diagnoses,
              (SELECT COUNT(*) FROM miss_rules WHERE miss_id = ${id}) AS rules`,
    );
    const counted = (rows as { diagnoses: number; rules: number }[])[0]!;
    expect([Number(counted.diagnoses), Number(counted.rules)]).toEqual([
      1,
      created.body.ruleIds.length,
    ]);
  });
});

describe('DELETE', () => {
  it('removes a miss with its photos’ files', async () => {
    const created = await postMultipart(owner, '/api/misses', fields(), [jpeg(), jpeg()]).expect(
      201,
    );
    const before = photoFiles(t);
    await owner.send('delete', `/api/misses/${created.body.id}`).expect(204);
    expect(photoFiles(t)).toHaveLength(before.length - 6);
    await owner.get(`/api/misses/${created.body.id}`).expect(404);
    await owner.get(`/api/photos/${created.body.photos[0].id}/image`).expect(404);
  });

  it('removes one photo and its files, keeping the miss', async () => {
    const created = await postMultipart(owner, '/api/misses', fields(), [jpeg(), jpeg()]).expect(
      201,
    );
    const before = photoFiles(t);
    const [first, second] = created.body.photos;
    await owner.send('delete', `/api/photos/${first.id}`).expect(204);
    expect(photoFiles(t)).toHaveLength(before.length - 3);
    const res = await owner.get(`/api/misses/${created.body.id}`).expect(200);
    expect(res.body.photos.map((p: { id: number }) => p.id)).toEqual([second.id]);
  });
});

describe('POST /api/misses/:id/photos', () => {
  it('adds photos up to four and refuses more, leaving nothing behind', async () => {
    const created = await postMultipart(owner, '/api/misses', fields(), [jpeg()]).expect(201);
    const id = created.body.id as number;
    const added = await postMultipart(owner, `/api/misses/${id}/photos`, {}, [jpeg(), jpeg()]);
    expect(added.status, added.text).toBe(201);
    expect(added.body.photos).toHaveLength(3);
    expect(added.body.photos.map((p: { position: number }) => p.position)).toEqual([1, 2, 3]);
    const before = await footprint(t);
    const over = await postMultipart(owner, `/api/misses/${id}/photos`, {}, [jpeg(), jpeg()]);
    expect(over.status).toBe(400);
    expect(over.body.fields.photos).toMatch(/at most 4 photos; this one has 3/);
    expect(await footprint(t)).toEqual(before);
    const none = await postMultipart(owner, `/api/misses/${id}/photos`, {});
    expect(none.status).toBe(400);
    expect(none.body.fields).toHaveProperty('photos');
  });

  it('adds photos sent four times at once up to four, in order, and refuses the rest', async () => {
    const created = await postMultipart(owner, '/api/misses', fields(), [jpeg()]).expect(201);
    const id = created.body.id as number;
    const before = photoFiles(t).length;
    // Four: a member's decode slots (two running, two waiting) answer 429 beyond that. On
    // PostgreSQL, without the miss's row lock, each counted and numbered the photos before the
    // others committed: all four were saved, five photos in all, two at a time on one position.
    const adds = await Promise.all(
      Array.from({ length: 4 }, () =>
        postMultipart(owner, `/api/misses/${id}/photos`, {}, [jpeg()]),
      ),
    );
    expect(adds.map((r) => r.status).sort()).toEqual([201, 201, 201, 400]);
    const refused = adds.find((r) => r.status === 400)!;
    expect(refused.body.fields.photos).toBe('a miss holds at most 4 photos; this one has 4');
    const after = await owner.get(`/api/misses/${id}`).expect(200);
    expect(after.body.photos.map((p: { position: number }) => p.position)).toEqual([1, 2, 3, 4]);
    // Three files a photo, none of the refused one's left behind.
    expect(photoFiles(t)).toHaveLength(before + 3 * 3);
  });
});
