import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import sqlite3 from 'sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { smallKeyOf } from '../src/storage/photo-storage.js';
import { startServerProcess, type ServerProcess } from './support/server-process.js';

const dataDir = mkdtempSync(path.join(tmpdir(), 'workback-crash-'));
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

const ENV = { DATA_DIR: dataDir, SEED_DEMO: 'true', SIGN_IN_LIMIT_PER_MINUTE: '1000' };
const BURST = 600;
const KILL_AFTER = 250;

/** A fetch-based client holding the session cookie and CSRF token, as a browser would. */
class HttpClient {
  cookie = '';
  token = '';
  constructor(public base: string) {}

  async call(method: string, url: string, body?: FormData | object): Promise<Response> {
    const headers: Record<string, string> = { cookie: this.cookie, 'x-csrf-token': this.token };
    let payload: FormData | string | undefined;
    if (body instanceof FormData) payload = body;
    else if (body !== undefined) {
      headers['content-type'] = 'application/json';
      payload = JSON.stringify(body);
    }
    // Bounded, so a request caught by the kill can never wait on a reused port.
    const res = await fetch(this.base + url, {
      method,
      headers,
      body: payload,
      signal: AbortSignal.timeout(60_000),
    });
    // The session cookie, and the CSRF cookie a visitor's token is tied to before sign-in.
    for (const set of res.headers.getSetCookie()) {
      const [pair] = set.split(';');
      const name = pair!.split('=')[0]!;
      const kept = this.cookie.split('; ').filter((c) => c && !c.startsWith(`${name}=`));
      this.cookie = [...kept, pair].join('; ');
    }
    return res;
  }

  async signIn(email: string): Promise<void> {
    this.token = (
      (await (await this.call('GET', '/api/auth/csrf')).json()) as { token: string }
    ).token;
    const res = await this.call('POST', '/api/auth/login', { email, password: 'workback-demo' });
    expect(res.status).toBe(200);
    this.token = (
      (await (await this.call('GET', '/api/auth/csrf')).json()) as { token: string }
    ).token;
  }
}

function query<T>(file: string, sql: string): Promise<T[]> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, sqlite3.OPEN_READONLY);
    db.all<T>(sql, (err, rows) => db.close(() => (err ? reject(err) : resolve(rows))));
  });
}

interface Acked {
  misses: { id: number; photos: number }[];
  notes: { id: number; missId: number }[];
  marks: { sittingId: number; pattern: boolean[] }[];
}

describe('crash durability', () => {
  it('keeps every acknowledged write whole through a kill -9, with no orphan files', async () => {
    let server: ServerProcess = await startServerProcess(ENV);
    const client = new HttpClient(server.url);
    await client.signIn('parent@workback.test');

    const students = (await (await client.call('GET', '/api/students')).json()) as {
      items: { id: number }[];
    };
    const studentId = students.items[0]!.id;
    const keys = (await (await client.call('GET', '/api/answer-keys')).json()) as {
      items: { id: number }[];
    };
    const key = (await (
      await client.call('GET', `/api/answer-keys/${keys.items[0]!.id}`)
    ).json()) as {
      id: number;
      items: { id: number; answer: string }[];
    };
    const sitting = (await (
      await client.call('POST', '/api/sittings', {
        studentId,
        answerKeyId: key.id,
        startedAt: '2026-11-30T09:30',
        minutes: 20,
      })
    ).json()) as { id: number };
    const png = await sharp({
      create: { width: 320, height: 240, channels: 3, background: '#f4efe2' },
    })
      .png()
      .toBuffer();

    const acked: Acked = { misses: [], notes: [], marks: [] };
    let sent = 0;
    let killed = false;
    const pendingMarks: boolean[][] = [];
    const count = () => acked.misses.length + acked.notes.length + acked.marks.length;

    const oneWrite = async (i: number) => {
      const kind = i % 5;
      if (kind === 3 && acked.misses.length > 0) {
        const missId = acked.misses[i % acked.misses.length]!.id;
        const res = await client.call('POST', '/api/notes', { missId, body: `Note ${i}` });
        if (res.status === 201)
          acked.notes.push({ id: ((await res.json()) as { id: number }).id, missId });
        return;
      }
      if (kind === 4) {
        const pattern = key.items.map((_, j) => (i + j) % 3 !== 0);
        pendingMarks.push(pattern);
        const marks = key.items.map((item, j) => ({
          keyItemId: item.id,
          correct: pattern[j]!,
          answer: pattern[j] ? item.answer : '0',
        }));
        const res = await client.call('PUT', `/api/sittings/${sitting.id}/marks`, { marks });
        if (res.ok) acked.marks.push({ sittingId: sitting.id, pattern });
        return;
      }
      const form = new FormData();
      form.set('studentId', String(studentId));
      form.set('occurredOn', '2026-11-30');
      form.set('problem', `${400 + i} - 75`);
      form.set('answer', String(400 + i - 75 + 100));
      form.set('explanation', `I took away, try ${i}`);
      const photos = kind === 0 ? 2 : kind === 1 ? 1 : 0;
      for (let p = 0; p < photos; p += 1) {
        form.append('photos', new Blob([png], { type: 'image/png' }), `page-${p}.png`);
      }
      const res = await client.call('POST', '/api/misses', form);
      if (res.status === 201)
        acked.misses.push({ id: ((await res.json()) as { id: number }).id, photos });
    };

    // Four lanes of writes; marks go through lane 0 only, so at most one marks write is in flight.
    const lane = async (offset: number) => {
      for (let i = offset; i < BURST && !killed; i += 4) {
        if (i % 5 === 4 && offset !== 0) continue;
        sent += 1;
        try {
          await oneWrite(i);
        } catch {
          // The connection died with the server: not acknowledged.
        }
        if (!killed && count() >= KILL_AFTER) {
          killed = true;
          server.child.kill('SIGKILL');
        }
      }
    };
    await Promise.all([0, 1, 2, 3].map(lane));
    await server.exited;
    expect(killed).toBe(true);
    expect(count()).toBeGreaterThanOrEqual(KILL_AFTER);
    expect(sent).toBeLessThan(BURST);

    // Sessions survive the crash too: the same cookie is still signed in after a restart.
    server = await startServerProcess(ENV);
    client.base = server.url;
    try {
      const me = await client.call('GET', '/api/auth/me');
      expect(me.status).toBe(200);

      for (const m of acked.misses) {
        const res = await client.call('GET', `/api/misses/${m.id}`);
        expect(res.status, `miss ${m.id}`).toBe(200);
        const miss = (await res.json()) as { photos: { id: number }[]; diagnosis: unknown };
        expect(miss.photos).toHaveLength(m.photos);
        expect(miss.diagnosis).not.toBeNull();
        for (const p of miss.photos) {
          const image = await client.call('GET', `/api/photos/${p.id}/image`);
          expect(image.status).toBe(200);
          expect((await image.arrayBuffer()).byteLength).toBeGreaterThan(0);
        }
      }
      for (const n of acked.notes) {
        const res = await client.call('GET', `/api/notes?missId=${n.missId}`);
        const notes = (await res.json()) as { items: { id: number }[] };
        expect(notes.items.map((x) => x.id)).toContain(n.id);
      }
      const saved = (await (await client.call('GET', `/api/sittings/${sitting.id}`)).json()) as {
        marks: { keyItemId: number; correct: boolean }[];
      };
      const final = key.items.map(
        (item) => saved.marks.find((x) => x.keyItemId === item.id)?.correct,
      );
      const lastAcked = acked.marks.at(-1)?.pattern;
      // The final marks are the last acknowledged save, or the one in flight at the kill.
      const candidates = [lastAcked, pendingMarks.at(-1)]
        .filter(Boolean)
        .map((p) => JSON.stringify(p));
      expect(candidates).toContain(JSON.stringify(final));
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
    }

    // Every photo row has its files and every file has its row (the start-up sweep took the rest).
    const rows = await query<{ storage_key: string; thumb_key: string }>(
      path.join(dataDir, 'workback.sqlite'),
      'SELECT storage_key, thumb_key FROM photos',
    );
    const needed = rows.flatMap((r) => [r.storage_key, r.thumb_key]);
    // The 128 px square is made at upload, or on first request for older photos: it may be
    // missing, but never left without its row.
    const allowed = new Set([...needed, ...rows.map((r) => smallKeyOf(r.storage_key))]);
    const files = readdirSync(path.join(dataDir, 'photos')).filter((f) => !f.startsWith('.'));
    expect(files.filter((f) => !allowed.has(f))).toEqual([]);
    expect(needed.filter((f) => !files.includes(f))).toEqual([]);
    for (const db of ['workback.sqlite', 'sessions.sqlite']) {
      const [check] = await query<{ integrity_check: string }>(
        path.join(dataDir, db),
        'PRAGMA integrity_check',
      );
      expect(check?.integrity_check).toBe('ok');
    }
  }, 400_000);
});
