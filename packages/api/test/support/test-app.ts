import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { inject } from 'vitest';
import type TestAgent from 'supertest/lib/agent.js';
import { createApp } from '../../src/app.factory.js';
import { createDatabase, databaseUrl, dropDatabase, newDatabaseName } from './pg.js';

export const DEMO_PASSWORD = 'workback-demo';
export const DEMO = {
  owner: 'parent@workback.test',
  parent: 'coparent@workback.test',
  tutor: 'tutor@workback.test',
  admin: 'admin@workback.test',
} as const;

export interface TestApp {
  app: NestExpressApplication;
  dataDir: string;
  http: () => TestAgent;
  close: () => Promise<void>;
}

/** Whether this project runs the API tests on PostgreSQL (api-pg) rather than SQLite (api). */
export function onPostgres(): boolean {
  return Boolean(inject('pgServerUrl'));
}

/**
 * The real app on a fresh temporary DATA_DIR (real SQLite files, real sessions); in the api-pg
 * project, on a PostgreSQL database of its own as well, dropped on close.
 */
export async function startTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'workback-test-'));
  // A copy of the once-seeded demo data stands in for seeding again (the seeder skips a
  // database that has users). A test that wants a fresh seed passes SEED_FRESH.
  const template = inject('demoTemplateDir');
  const fromTemplate = (env.SEED_DEMO ?? 'true') === 'true' && !env.SEED_FRESH;
  if (template && fromTemplate) {
    cpSync(template, dataDir, { recursive: true });
  }
  const pgServer = inject('pgServerUrl');
  const database = pgServer ? newDatabaseName('workback_test') : undefined;
  if (pgServer && database) {
    await createDatabase(pgServer, database, fromTemplate ? inject('pgTemplate') : undefined);
  }
  Object.assign(process.env, {
    NODE_ENV: 'test',
    DATA_DIR: dataDir,
    DATABASE_URL: pgServer && database ? databaseUrl(pgServer, database) : '',
    SEED_DEMO: 'true',
    ADMIN_EMAILS: '',
    SESSION_IDLE_MINUTES: '30',
    SESSION_MAX_HOURS: '12',
    ...env,
  });
  const { app } = await createApp();
  // Listening once lets supertest reuse the address; an idle server makes it bind and close a
  // port for every request.
  await app.listen(0, '127.0.0.1');
  const server = app.getHttpServer();
  return {
    app,
    dataDir,
    http: () => request.agent(server),
    close: async () => {
      await app.close();
      rmSync(dataDir, { recursive: true, force: true });
      if (pgServer && database) await dropDatabase(pgServer, database);
    },
  };
}

/** A cookie-carrying client that fetches and sends the CSRF token like the web app does. */
export class Client {
  token = '';
  /** The session cookie as last set by the server, for replaying it by hand. */
  cookie = '';

  constructor(readonly agent: TestAgent) {}

  async refreshToken(): Promise<string> {
    const res = await this.agent.get('/api/auth/csrf').expect(200);
    this.token = (res.body as { token: string }).token;
    return this.token;
  }

  get(url: string) {
    return this.agent.get(url);
  }

  send(method: 'get' | 'post' | 'put' | 'patch' | 'delete', url: string, body?: object) {
    const req = this.agent[method](url).set('x-csrf-token', this.token);
    return body === undefined ? req : req.send(body);
  }

  post(url: string, body?: object) {
    return this.send('post', url, body);
  }

  async signIn(email: string, password = DEMO_PASSWORD) {
    await this.refreshToken();
    const res = await this.post('/api/auth/login', { email, password });
    this.cookie = sessionCookie(res.headers) ?? this.cookie;
    if (res.status === 200) await this.refreshToken();
    return res;
  }
}

export async function signedIn(
  t: TestApp,
  email: string,
  password = DEMO_PASSWORD,
): Promise<Client> {
  const client = new Client(t.http());
  const res = await client.signIn(email, password);
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${res.text}`);
  return client;
}

export async function registered(t: TestApp, email: string, householdName = 'Test household') {
  const client = new Client(t.http());
  await client.refreshToken();
  const res = await client.post('/api/auth/register', {
    email,
    password: 'a-long-enough-password',
    displayName: 'Tester',
    householdName,
    adultConfirmed: true,
  });
  if (res.status !== 201) throw new Error(`register failed: ${res.status} ${res.text}`);
  await client.refreshToken();
  return client;
}

export function sessionCookie(headers: Record<string, unknown>): string | undefined {
  const set = (headers['set-cookie'] as string[] | undefined) ?? [];
  return set.find((c) => c.startsWith('workback.sid='))?.split(';')[0];
}
