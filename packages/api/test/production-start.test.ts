import { mkdtempSync, rmSync } from 'node:fs';
import { getPriority, tmpdir } from 'node:os';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FakeSmtpServer } from '../src/mail/fake-smtp-server.js';
import { startServerProcess, type ServerProcess } from './support/server-process.js';
import { niceByThread } from './support/thread-nice.js';
import { Client, DEMO, DEMO_PASSWORD } from './support/test-app.js';

const dirs: string[] = [];
const freshDataDir = () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'workback-prod-'));
  dirs.push(dir);
  return dir;
};
afterAll(() => dirs.forEach((d) => rmSync(d, { recursive: true, force: true })));

// The real server as its own process; '' unsets what the test runner's own environment holds.
const NOTHING_CONFIGURED = {
  NODE_ENV: 'production',
  SMTP_URL: '',
  PUBLIC_URL: '',
  SEED_DEMO: '',
  ADMIN_EMAILS: '',
  LOG_LEVEL: 'silent',
};

describe('production with nothing configured', () => {
  it('refuses to start, naming SMTP_URL and PUBLIC_URL', async () => {
    const dataDir = freshDataDir();
    const started = await startServerProcess({ ...NOTHING_CONFIGURED, DATA_DIR: dataDir }).then(
      (server) => {
        server.child.kill('SIGKILL');
        return server.output();
      },
      (err: Error) => err,
    );
    expect(started, 'the server started').toBeInstanceOf(Error);
    const message = (started as Error).message;
    expect(message).toMatch(/SMTP_URL: must be set in production/);
    expect(message).toMatch(/PUBLIC_URL: must be set in production/);
    expect(message).not.toMatch(/running at/);
  }, 180_000);
});

describe('production with SMTP_URL and PUBLIC_URL', () => {
  const PUBLIC_URL = 'https://workback.example.test';
  const received: { to: string[]; raw: Buffer }[] = [];
  // Stands in for the mail provider: a separate SMTP server the app only knows by its URL.
  const relay = new FakeSmtpServer(async (raw, to) => {
    received.push({ to, raw });
  });
  let server: ServerProcess;

  beforeAll(async () => {
    const port = await relay.start();
    server = await startServerProcess({
      ...NOTHING_CONFIGURED,
      DATA_DIR: freshDataDir(),
      SMTP_URL: `smtp://127.0.0.1:${port}`,
      PUBLIC_URL,
    });
  }, 180_000);
  afterAll(async () => {
    server?.child.kill('SIGTERM');
    await server?.exited;
    await relay.stop();
  });

  const client = async () => {
    const c = new Client(request.agent(server.url));
    await c.refreshToken();
    return c;
  };

  it('runs every thread but the event loop nicer (HELPER_THREAD_NICENESS, 10 unless set)', () => {
    const nice = niceByThread(server.child.pid!);
    // The server starts as nice as this runner (a CI job may itself run nicer).
    const inherited = getPriority();
    expect(nice.get(server.child.pid!)).toBe(inherited);
    const helpers = [...nice].filter(([tid]) => tid !== server.child.pid);
    // libuv's pool (16), V8's platform threads and more: the entry started them all.
    expect(helpers.length).toBeGreaterThan(10);
    for (const [tid, value] of helpers)
      expect(value, `thread ${tid}`).toBe(Math.max(10, inherited));
  });

  it('serves no outbox, as JSON or as a page', async () => {
    const c = await client();
    expect((await c.get('/api/dev/outbox')).status).toBe(404);
    expect((await c.get('/dev/outbox').set('accept', 'text/html')).status).toBe(404);
    expect(server.output()).not.toMatch(/dev\/outbox/);
  });

  it('has no demo: the demo sign-ins fail and health says so', async () => {
    const c = await client();
    expect((await c.get('/api/health').expect(200)).body.demo).toBe(false);
    for (const email of Object.values(DEMO)) {
      const res = await c.post('/api/auth/login', { email, password: DEMO_PASSWORD });
      expect(res.status, email).toBe(401);
    }
    expect(server.output()).not.toMatch(/Demo sign-ins/);
  });

  it('mails links from PUBLIC_URL to the relay, whatever Host the request names', async () => {
    const c = await client();
    const res = await c
      .post('/api/auth/register', {
        email: 'first@example.test',
        password: 'a-long-enough-password',
        displayName: 'First',
        householdName: 'The First household',
        adultConfirmed: true,
      })
      .set('Host', 'evil.example:8080')
      .set('X-Forwarded-Host', 'evil.example');
    expect(res.status, res.text).toBe(201);
    const mail = received.find((m) => m.to.includes('first@example.test'));
    expect(mail, 'a confirmation mail reached the relay').toBeDefined();
    const text = (await simpleParser(mail!.raw)).text;
    expect(text).toContain(`${PUBLIC_URL}/verify-email/`);
    expect(text).not.toContain('evil.example');
  });
});
