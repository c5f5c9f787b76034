import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { type FakeS3, startFakeS3 } from './support/fake-s3.js';
import { createDatabase, databaseUrl, dropDatabase, newDatabaseName } from './support/pg.js';
import { fixture, postMultipart, studentIds, today } from './support/photos.js';
import { type ServerProcess, startServerProcess } from './support/server-process.js';
import { Client, DEMO } from './support/test-app.js';

// Past one machine: two server processes, each with its own DATA_DIR and the same
// SESSION_SECRET, share one PostgreSQL database and one S3-compatible bucket (s3rver), as
// they would behind a load balancer. api-pg only: with SQLite each process has its own files.
const server = inject('pgServerUrl');
const database = newDatabaseName('workback_two');
const dirs: string[] = [];
let s3: FakeS3;
let a: ServerProcess;
let b: ServerProcess;

async function start(): Promise<ServerProcess> {
  const dir = mkdtempSync(path.join(tmpdir(), 'workback-proc-'));
  dirs.push(dir);
  return startServerProcess({
    ...s3.env,
    DATA_DIR: dir,
    DATABASE_URL: databaseUrl(server, database),
    SESSION_SECRET: 'one-secret-shared-by-every-process-of-the-service',
    SEED_DEMO: 'true',
    ADMIN_EMAILS: '',
    SIGN_IN_LIMIT_PER_MINUTE: '3',
    LOG_LEVEL: 'warn',
  });
}

beforeAll(async () => {
  s3 = await startFakeS3();
  await createDatabase(server, database, inject('pgTemplate'));
  // One after the other would hide a race between two migrators; start them together.
  [a, b] = await Promise.all([start(), start()]);
}, 300_000);

afterAll(async () => {
  for (const p of [a, b]) {
    if (p && p.child.exitCode === null) {
      p.child.kill('SIGTERM');
      await p.exited;
    }
  }
  await s3?.close();
  await dropDatabase(server, database);
  for (const dir of dirs) rmSync(dir, { recursive: true, force: true });
}, 60_000);

/** A request to `p` carrying the session cookie (and CSRF token) a sign-in elsewhere gave. */
function as(p: ServerProcess, client: Client) {
  const http = request(p.url);
  return {
    get: (url: string) => http.get(url).set('Cookie', client.cookie),
    patch: (url: string, body: object) =>
      http.patch(url).set('Cookie', client.cookie).set('x-csrf-token', client.token).send(body),
  };
}

describe('two processes, one PostgreSQL and one bucket', () => {
  it('knows a sign-in made on the other process', async () => {
    const owner = new Client(request.agent(a.url));
    expect((await owner.signIn(DEMO.owner)).status).toBe(200);
    const me = await as(b, owner).get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe(DEMO.owner);
    // And a stranger's cookie is nobody on either.
    await request(b.url).get('/api/auth/me').set('Cookie', 'workback.sid=s%3Anobody.x').expect(401);
  });

  it('reads, searches, diagnoses and serves on one a miss and its photo written on the other', async () => {
    const owner = new Client(request.agent(a.url));
    await owner.signIn(DEMO.owner);
    const wren = (await studentIds(owner)).get('Wren')!;
    const created = await postMultipart(
      owner,
      '/api/misses',
      {
        studentId: wren,
        occurredOn: today(),
        problem: '81 - 38',
        answer: '57',
        explanation: 'took the small from the big in every column, two-process marker',
      },
      [{ name: 'work.png', data: fixture('sheet.png'), type: 'image/png' }],
    );
    expect(created.status, created.text).toBe(201);
    const id = created.body.id as number;
    const photo = created.body.photos[0].id as number;

    const onB = as(b, owner);
    const read = await onB.get(`/api/misses/${id}`).expect(200);
    expect(read.body).toMatchObject({ problem: '81 - 38', answer: '57' });
    // 81 − 38 written 57: SMALLER-FROM-LARGER (Brown & Burton 1978; from memory).
    expect(read.body.ruleIds[0]).toBe('sub.smaller-from-larger');

    const found = await onB.get('/api/misses?q=two-process%20marker').expect(200);
    expect(found.body.items.map((m: { id: number }) => m.id)).toEqual([id]);

    const image = await onB.get(`/api/photos/${photo}/image`).buffer(true).expect(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    expect(image.headers['cache-control']).toBe('private, max-age=3600');
    expect(image.headers['x-content-type-options']).toBe('nosniff');
    expect((await sharp(image.body as Buffer).metadata()).format).toBe('jpeg');

    // Re-diagnosed on B, read back on A.
    await onB.patch(`/api/misses/${id}`, { answer: '53' }).expect(200);
    const again = await owner.get(`/api/misses/${id}`).expect(200);
    // 53: BORROW-NO-DECREMENT (Brown & Burton 1978; from memory).
    expect(again.body.ruleIds[0]).toBe('sub.borrow-no-decrement');

    // Still the household's own: another household's member gets 404 on either process.
    const tutor = new Client(request.agent(b.url));
    await tutor.signIn(DEMO.tutor);
    const milo = (await studentIds(owner)).get('Milo')!;
    const milos = await postMultipart(owner, '/api/misses', {
      studentId: milo,
      occurredOn: today(),
      problem: '47 + 38',
      answer: '75',
    });
    expect(milos.status).toBe(201);
    await as(a, tutor).get(`/api/misses/${milos.body.id}`).expect(404);
  });

  /** One owner session on A for the tests below (SIGN_IN_LIMIT_PER_MINUTE is 3 per address). */
  let ownerOnA: Promise<Client> | undefined;
  const signedInOnA = () =>
    (ownerOnA ??= (async () => {
      const owner = new Client(request.agent(a.url));
      expect((await owner.signIn(DEMO.owner)).status).toBe(200);
      return owner;
    })());

  it('holds on one process, at its next request, a grant taken away on the other', async () => {
    const owner = await signedInOnA();
    const students = await studentIds(owner);
    const [wren, milo] = [students.get('Wren')!, students.get('Milo')!];
    const members = (await owner.get('/api/members').expect(200)).body.items as {
      id: number;
      email: string;
    }[];
    const grant = members.find((m) => m.email === DEMO.tutor)!.id;
    const tutor = new Client(request.agent(b.url));
    await tutor.signIn(DEMO.tutor);
    // The demo tutor works with Wren; asked twice on B, as a busy tutor would.
    await tutor.get(`/api/students/${wren}`).expect(200);
    await tutor.get(`/api/students/${wren}`).expect(200);
    await tutor.get(`/api/students/${milo}`).expect(404);
    try {
      await owner.send('patch', `/api/members/${grant}`, { studentIds: [milo] }).expect(200);
      // No wait: B's very next request already knows.
      await tutor.get(`/api/students/${wren}`).expect(404);
      await tutor.get(`/api/students/${milo}`).expect(200);
    } finally {
      await owner.send('patch', `/api/members/${grant}`, { studentIds: [wren] }).expect(200);
    }
    await tutor.get(`/api/students/${wren}`).expect(200);
  });

  it('counts on one process a miss just logged on the other', async () => {
    const owner = await signedInOnA();
    const wren = (await studentIds(owner)).get('Wren')!;
    const onB = as(b, owner);
    const list = `/api/misses?studentId=${wren}`;
    const before = (await onB.get(list).expect(200)).body.total as number;
    expect((await onB.get(list).expect(200)).body.total).toBe(before);
    const created = await postMultipart(owner, '/api/misses', {
      studentId: wren,
      occurredOn: today(),
      problem: '62 - 27',
      answer: '45',
    });
    expect(created.status, created.text).toBe(201);
    expect((await onB.get(list).expect(200)).body.total).toBe(before + 1);
  });

  it('holds a sign-in limit counted on one process on the other', async () => {
    const tries = async (p: ServerProcess) =>
      (await new Client(request.agent(p.url)).signIn(DEMO.parent, 'not-the-password')).status;
    // SIGN_IN_LIMIT_PER_MINUTE=3 for one address: three refusals on A, the fourth try on B.
    expect([await tries(a), await tries(a), await tries(a)]).toEqual([401, 401, 401]);
    expect(await tries(b)).toBe(429);
  });
});
