import { Writable } from 'node:stream';
import { getConnectionToken } from '@nestjs/sequelize';
import express from 'express';
import request from 'supertest';
import type { Sequelize } from 'sequelize-typescript';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLogger, requestLog } from '../src/common/logging/request-log.js';
import { MemberCache } from '../src/households/member-cache.js';
import {
  Client,
  DEMO,
  onPostgres,
  sessionCookie,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

/** A pino destination that keeps each JSON line. */
function memoryLog() {
  const lines: Record<string, unknown>[] = [];
  const stream = new Writable({
    write(chunk: Buffer, _enc, done) {
      for (const line of chunk.toString().split('\n').filter(Boolean)) lines.push(JSON.parse(line));
      done();
    },
  });
  return { lines, stream };
}

describe('the request log line', () => {
  function appWith(level: string) {
    const log = memoryLog();
    const app = express();
    app.use(requestLog(createLogger(level, false, log.stream)));
    app.get('/api/misses/:id', (_req, res) => res.json({ ok: true }));
    app.get('/api/boom', (_req, res) => res.status(500).json({}));
    return { app, lines: log.lines };
  }

  it('is one compact line per request: method, route, status, ms and request id', async () => {
    const { app, lines } = appWith('info');
    const res = await request(app)
      .get('/api/misses/42?q=Wren')
      .set('cookie', 'workback.sid=secret')
      .expect(200);
    expect(lines).toHaveLength(1);
    const line = lines[0]!;
    expect(Object.keys(line).sort()).toEqual(
      ['level', 'method', 'ms', 'reqId', 'route', 'status', 'time'].sort(),
    );
    expect(line).toMatchObject({ level: 30, method: 'GET', route: '/api/misses/:id', status: 200 });
    expect(typeof line.ms).toBe('number');
    // The id sent back is the one logged; the URL's id and search words are not in the line.
    expect(line.reqId).toBe(res.headers['x-request-id']);
    expect(JSON.stringify(line)).not.toMatch(/misses\/42|Wren|secret/);
  });

  it('is an error line for a 5xx', async () => {
    const { app, lines } = appWith('info');
    await request(app).get('/api/boom').expect(500);
    expect(lines[0]).toMatchObject({ level: 50, route: '/api/boom', status: 500 });
  });

  it('carries the full headers only at debug, with credentials redacted', async () => {
    const { app, lines } = appWith('debug');
    await request(app)
      .get('/api/misses/7')
      .set('cookie', 'workback.sid=secret')
      .set('x-csrf-token', 'token-value')
      .set('accept-language', 'en')
      .expect(200);
    const line = lines[0] as {
      req: { headers: Record<string, string> };
      res: { headers: Record<string, string> };
    };
    expect(line.req.headers['accept-language']).toBe('en');
    expect(line.req.headers.cookie).toBe('[Redacted]');
    expect(line.req.headers['x-csrf-token']).toBe('[Redacted]');
    expect(line.res.headers['content-type']).toMatch(/json/);
    expect(JSON.stringify(line)).not.toMatch(/secret|token-value/);
  });
});

describe('per-request work of the real app', () => {
  let t: TestApp;
  let owner: Client;
  let sequelize: Sequelize;
  let wren: number;
  let milo: number;

  beforeAll(async () => {
    t = await startTestApp({ SMTP_URL: '', SIGN_IN_LIMIT_PER_MINUTE: '1000' });
    sequelize = t.app.get<Sequelize>(getConnectionToken());
    owner = await signedIn(t, DEMO.owner);
    const students = (await owner.get('/api/students').expect(200)).body.items as {
      id: number;
      name: string;
    }[];
    wren = students.find((s) => s.name === 'Wren')!.id;
    milo = students.find((s) => s.name === 'Milo')!.id;
  });
  afterAll(() => t.close());

  const seen = async (c: Client) =>
    ((await c.get('/api/students').expect(200)).body.items as { id: number }[])
      .map((s) => s.id)
      .sort();
  const tutorMember = async () =>
    (
      (await owner.get('/api/members').expect(200)).body.items as { id: number; email: string }[]
    ).find((m) => m.email === DEMO.tutor)!;

  it('keeps a member’s context between requests: a grant written past the app is not seen', async () => {
    const tutor = await signedIn(t, DEMO.tutor);
    expect(await seen(tutor)).toEqual([wren]);
    const { id } = await tutorMember();
    // Straight into the table, past the models' hooks: the cached context still holds. On
    // PostgreSQL nothing is kept (another process may have written it), so it shows at once.
    await sequelize.query(
      'INSERT INTO student_grants (membership_id, student_id, created_at) VALUES (?, ?, ?)',
      { replacements: [id, milo, new Date().toISOString()] },
    );
    try {
      expect(await seen(tutor)).toEqual(onPostgres() ? [milo, wren].sort() : [wren]);
      t.app.get(MemberCache).clear();
      expect(await seen(tutor)).toEqual([milo, wren].sort());
    } finally {
      await owner.send('patch', `/api/members/${id}`, { studentIds: [wren] }).expect(200);
    }
  });

  it('forgets the context when grants change, the role changes, or the member is removed', async () => {
    const tutor = await signedIn(t, DEMO.tutor);
    const { id } = await tutorMember();
    expect(await seen(tutor)).toEqual([wren]);

    await owner.send('patch', `/api/members/${id}`, { studentIds: [milo] }).expect(200);
    expect(await seen(tutor)).toEqual([milo]);
    await tutor.get(`/api/students/${wren}`).expect(404);

    await owner.send('patch', `/api/members/${id}`, { role: 'parent' }).expect(200);
    expect(await seen(tutor)).toEqual([milo, wren].sort());
    // A parent may list the members; a tutor may not.
    await tutor.get('/api/members').expect(200);

    await owner
      .send('patch', `/api/members/${id}`, { role: 'tutor', studentIds: [wren] })
      .expect(200);
    await tutor.get('/api/members').expect(403);
    expect(await seen(tutor)).toEqual([wren]);

    await owner.send('delete', `/api/members/${id}`).expect(204);
    await tutor.get('/api/students').expect(403);
  });

  it('answers 304 to a notebook page that has not changed, and a new ETag once it has', async () => {
    const first = await owner.get('/api/misses?page=1').expect(200);
    const etag = first.headers.etag as string;
    expect(etag).toBeTruthy();
    const again = await owner.get('/api/misses?page=1').set('if-none-match', etag).expect(304);
    expect(again.text).toBeFalsy();
    await owner
      .post('/api/misses', {
        studentId: wren,
        occurredOn: new Date().toISOString().slice(0, 10),
        problem: '52 - 17',
        answer: '45',
      })
      .expect(201);
    const changed = await owner.get('/api/misses?page=1').set('if-none-match', etag).expect(200);
    expect(changed.headers.etag).not.toBe(etag);
    expect(changed.body.total).toBe(first.body.total + 1);
  });

  it('answers a notebook page gzipped to a browser, plain otherwise, each with its own ETag', async () => {
    // A representation's encoding is part of it: each has its own validator (RFC 9110, 8.8.3).
    const plain = await owner
      .get('/api/misses?page=1')
      .set('accept-encoding', 'identity')
      .expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.headers.vary).toMatch(/accept-encoding/i);
    // superagent inflates the body, so both are compared as JSON.
    const zipped = await owner
      .get('/api/misses?page=1')
      .set('accept-encoding', 'gzip, deflate')
      .expect(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.headers['content-type']).toMatch(/^application\/json/);
    expect(zipped.headers.vary).toMatch(/accept-encoding/i);
    expect(zipped.body).toEqual(plain.body);
    expect(zipped.headers.etag).not.toBe(plain.headers.etag);
    // Each ETag is fresh for its own representation only.
    await owner
      .get('/api/misses?page=1')
      .set('accept-encoding', 'gzip')
      .set('if-none-match', zipped.headers.etag!)
      .expect(304);
    await owner
      .get('/api/misses?page=1')
      .set('accept-encoding', 'gzip;q=0, identity')
      .set('if-none-match', zipped.headers.etag!)
      .expect(200)
      .expect((res) => expect(res.headers['content-encoding']).toBeUndefined());
  });

  it('counts each finished API answer once, by its status class, for the site admin', async () => {
    const admin = await signedIn(t, DEMO.admin);
    const counts = async () =>
      (await admin.get('/api/admin/metrics').expect(200)).body.requests as Record<string, number>;
    const before = await counts();
    await t.http().get('/api/no-such-route').expect(404);
    await t.http().get('/api/health').expect(200);
    await t.http().get('/api/health').expect(200);
    const after = await counts();
    expect(after['4xx']).toBe(before['4xx']! + 1);
    // The two health checks, and the first metrics answer itself once it had been sent.
    expect(after['2xx']).toBe(before['2xx']! + 3);
    expect(after.total).toBe(before.total! + 4);
  });

  it('reads no session for /api/health, even with a session cookie', async () => {
    const res = await t.http().get('/api/health').set('cookie', owner.cookie).expect(200);
    // A session route renews the rolling cookie on every answer; health does not touch it.
    expect(sessionCookie(res.headers)).toBeUndefined();
    const api = await t.http().get('/api/misses?page=1').set('cookie', owner.cookie).expect(200);
    expect(sessionCookie(api.headers)).toBeDefined();
  });

  it('answers health with the same JSON and ETag each time, uncompressed, and a 304 for it', async () => {
    const first = await t.http().get('/api/health').set('accept-encoding', 'gzip').expect(200);
    expect(first.body).toMatchObject({ status: 'ok', version: expect.any(String) });
    expect(first.headers['content-type']).toMatch(/^application\/json/);
    expect(first.headers['content-encoding']).toBeUndefined();
    expect(first.headers['x-content-type-options']).toBe('nosniff');
    const again = await t.http().get('/api/health').expect(200);
    expect(again.text).toBe(first.text);
    expect(again.headers.etag).toBe(first.headers.etag);
    await t.http().get('/api/health').set('if-none-match', first.headers.etag!).expect(304);
    // Other answers are still compressed when asked for (a notebook page is well over 1 kB).
    const page = await owner.get('/api/misses?page=1').set('accept-encoding', 'gzip').expect(200);
    expect(page.headers['content-encoding']).toBe('gzip');
  });
});
