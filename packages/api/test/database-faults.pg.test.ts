import net from 'node:net';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createDatabase, databaseUrl, dropDatabase, newDatabaseName } from './support/pg.js';
import { type Client, DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

// PostgreSQL busy or out of reach: the request answers 503 with Retry-After and a plain
// message, never a 500 with the driver's words, and nothing is half-written. The app talks to
// its database through a TCP relay the test can cut, as a stopped server or a broken network
// would. api-pg only (SQLite's SQLITE_BUSY is in storage-full.test.ts).
const server = inject('pgServerUrl');
const database = newDatabaseName('workback_faults');
let t: TestApp;
let relay: Relay;
let owner: Client;

/** A TCP relay in front of the PostgreSQL server that can be cut and restored on its port. */
interface Relay {
  port: number;
  cut: () => Promise<void>;
  restore: () => Promise<void>;
}

async function startRelay(target: URL): Promise<Relay> {
  const sockets = new Set<net.Socket>();
  const listener = net.createServer((client) => {
    const upstream = net.connect(Number(target.port), target.hostname);
    for (const s of [client, upstream]) {
      sockets.add(s);
      s.on('close', () => sockets.delete(s));
      s.on('error', () => s.destroy());
    }
    client.pipe(upstream).pipe(client);
  });
  const listen = (port: number) =>
    new Promise<void>((resolve) => listener.listen(port, '127.0.0.1', resolve));
  await listen(0);
  const port = (listener.address() as net.AddressInfo).port;
  return {
    port,
    cut: async () => {
      const closed = new Promise((resolve) => listener.close(resolve));
      for (const s of sockets) s.destroy();
      await closed;
    },
    restore: () => listen(port),
  };
}

/** Our own connection to the app's database, straight to the server (not through the relay). */
async function direct<T>(work: (c: pg.Client) => Promise<T>): Promise<T> {
  const c = new pg.Client({ connectionString: databaseUrl(server, database) });
  await c.connect();
  try {
    return await work(c);
  } finally {
    await c.end();
  }
}

const others = `pid <> pg_backend_pid() AND datname = current_database()`;

async function studentCount(): Promise<number> {
  return direct(async (c) =>
    Number((await c.query('SELECT COUNT(*) AS n FROM students')).rows[0].n),
  );
}

beforeAll(async () => {
  await createDatabase(server, database, inject('pgTemplate'));
  relay = await startRelay(new URL(server));
  const via = new URL(databaseUrl(server, database));
  via.port = String(relay.port);
  t = await startTestApp({ DATABASE_URL: via.toString() });
  owner = await signedIn(t, DEMO.owner);
}, 120_000);

afterAll(async () => {
  await t?.close();
  await relay?.cut();
  await dropDatabase(server, database);
}, 60_000);

function expectUnavailable(
  res: { status: number; headers: Record<string, string>; body: { message: string } },
  message: RegExp,
) {
  expect(res.status).toBe(503);
  expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  expect(res.body).toMatchObject({ statusCode: 503, error: 'Service Unavailable' });
  expect(res.body.message).toMatch(message);
  // Nothing of the driver's or the SQL's own words reaches the family.
  expect(JSON.stringify(res.body)).not.toMatch(/terminat|lock|students|SQL|ECONN|pg_/i);
}

describe('PostgreSQL busy or out of reach', () => {
  it('answers 503 when the connection under a waiting write is terminated (57P01)', async () => {
    const before = await studentCount();
    await direct(async (locker) => {
      await locker.query('BEGIN');
      await locker.query('LOCK TABLE students IN ACCESS EXCLUSIVE MODE');
      const pending = owner
        .post('/api/students', { name: 'Waits', gradeLevel: '2' })
        .then((r) => r);
      // The app's insert waits on the lock; end its backend as an operator or a restart would.
      let ended = 0;
      for (let i = 0; i < 200 && ended === 0; i += 1) {
        const { rows } = await locker.query(
          `SELECT pg_terminate_backend(pid) AS ended FROM pg_stat_activity
           WHERE ${others} AND wait_event_type = 'Lock'`,
        );
        ended = rows.length;
        if (!ended) await new Promise((r) => setTimeout(r, 25));
      }
      expect(ended).toBe(1);
      expectUnavailable(await pending, /cannot reach its database right now, so nothing was saved/);
      await locker.query('ROLLBACK');
    });
    expect(await studentCount()).toBe(before);
    // The pool lets the broken connection go: the same request now goes through.
    await owner.post('/api/students', { name: 'After a restart', gradeLevel: '2' }).expect(201);
  });

  it('answers 503 when a write waits past lock_timeout (55P03), and saves once the lock is gone', async () => {
    const before = await studentCount();
    await direct(async (c) => {
      await c.query(`ALTER DATABASE "${database}" SET lock_timeout = '300ms'`);
      // The app's connections take the setting when they are made again.
      await c.query(`SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE ${others}`);
    });
    try {
      await direct(async (locker) => {
        await locker.query('BEGIN');
        await locker.query('LOCK TABLE students IN ACCESS EXCLUSIVE MODE');
        const res = await owner.post('/api/students', { name: 'Waits', gradeLevel: '2' });
        expectUnavailable(res, /busy with other changes, so nothing was saved/);
        await locker.query('ROLLBACK');
      });
      expect(await studentCount()).toBe(before);
      await owner.post('/api/students', { name: 'After the lock', gradeLevel: '2' }).expect(201);
    } finally {
      await direct((c) => c.query(`ALTER DATABASE "${database}" RESET lock_timeout`));
    }
  });

  it('answers 503 while the database cannot be reached at all, and serves again when it is back', async () => {
    await relay.cut();
    try {
      // The session store is the first to fail: its error takes the same way out as a route's.
      expectUnavailable(
        await owner.get('/api/students'),
        /cannot reach its database right now, so nothing was saved/,
      );
      expectUnavailable(
        await owner.post('/api/students', { name: 'Unreachable', gradeLevel: '2' }),
        /cannot reach its database right now/,
      );
    } finally {
      await relay.restore();
    }
    const res = await owner.get('/api/students').expect(200);
    expect(res.body.items.map((s: { name: string }) => s.name)).not.toContain('Unreachable');
  });
});
