import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

let t: TestApp;

beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const cookieOf = (res: { headers: Record<string, unknown> }) =>
  ((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) =>
    c.startsWith('workback.sid='),
  );

describe('sign-up', () => {
  it('creates a household with its owner and signs in', async () => {
    const client = new Client(t.http());
    await client.refreshToken();
    const res = await client.post('/api/auth/register', {
      email: 'New.Parent@Example.test',
      password: 'kitchen-table',
      displayName: 'Avery',
      householdName: 'The Brook household',
      adultConfirmed: true,
    });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'new.parent@example.test', isAdmin: false });
    expect(res.body.household).toMatchObject({ name: 'The Brook household', role: 'owner' });
    await client.refreshToken();
    const students = await client.get('/api/students').expect(200);
    expect(students.body).toEqual({ items: [], total: 0 });
  });

  it('refuses a missing adult confirmation, naming the field, and creates nothing', async () => {
    const client = new Client(t.http());
    await client.refreshToken();
    const res = await client.post('/api/auth/register', {
      email: 'minor@example.test',
      password: 'kitchen-table',
      displayName: 'Kid',
      householdName: 'Nope',
    });
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ statusCode: 400, error: 'Bad Request' });
    expect(res.body.fields).toHaveProperty('adultConfirmed');
    const login = await client.post('/api/auth/login', {
      email: 'minor@example.test',
      password: 'kitchen-table',
    });
    expect(login.status).toBe(401);
  });

  it('refuses short passwords and unknown properties', async () => {
    const client = new Client(t.http());
    await client.refreshToken();
    const short = await client.post('/api/auth/register', {
      email: 'short@example.test',
      password: 'short',
      displayName: 'A',
      householdName: 'B',
      adultConfirmed: true,
    });
    expect(short.status).toBe(400);
    expect(short.body.fields.password).toMatch(/8 to 128/);
    const sneaky = await client.post('/api/auth/register', {
      email: 'sneaky@example.test',
      password: 'long-enough-1',
      displayName: 'A',
      householdName: 'B',
      adultConfirmed: true,
      role: 'admin',
    });
    expect(sneaky.status).toBe(400);
    expect(sneaky.body.fields).toHaveProperty('role');
  });

  it('answers 409 for an e-mail already registered', async () => {
    await registered(t, 'twice@example.test');
    const client = new Client(t.http());
    await client.refreshToken();
    const res = await client.post('/api/auth/register', {
      email: 'twice@example.test',
      password: 'long-enough-1',
      displayName: 'A',
      householdName: 'B',
      adultConfirmed: true,
    });
    expect(res.status).toBe(409);
    expect(res.body.fields).toHaveProperty('email');
  });
});

describe('sign-in and sessions', () => {
  it('gives the same answer for an unknown e-mail and a wrong password', async () => {
    const client = new Client(t.http());
    const unknown = await client.signIn('nobody@example.test', 'whatever-123');
    const wrong = await client.signIn('coparent@workback.test', 'not-the-password');
    expect(unknown.status).toBe(401);
    expect(wrong.status).toBe(401);
    expect(unknown.body.message).toBe(wrong.body.message);
  });

  it('names the bad field on a malformed login body', async () => {
    const client = new Client(t.http());
    await client.refreshToken();
    const res = await client.post('/api/auth/login', { email: 'not-an-email' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fields)).toEqual(expect.arrayContaining(['email']));
  });

  it('sets an HttpOnly, SameSite=Lax cookie of our own name', async () => {
    const client = new Client(t.http());
    await client.refreshToken();
    const res = await client.post('/api/auth/login', {
      email: DEMO.parent,
      password: 'workback-demo',
    });
    expect(res.status).toBe(200);
    const cookie = cookieOf(res);
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/connect\.sid/);
  });

  it('rotates the session id at sign-in: the pre-login cookie is no longer signed in', async () => {
    // Fetching a token stores no session, so a stored one from an earlier sign-in stands in
    // for a session id planted before this sign-in.
    const client = await signedIn(t, DEMO.parent);
    const preCookie = client.cookie;
    const login = await client.post('/api/auth/login', {
      email: DEMO.owner,
      password: 'workback-demo',
    });
    const postCookie = cookieOf(login)!.split(';')[0]!;
    expect(postCookie).not.toBe(preCookie);
    await client.get('/api/auth/me').expect(200);
    const replay = await t.http().get('/api/auth/me').set('Cookie', preCookie);
    expect(replay.status).toBe(401);
  });

  it('ends the session at logout: the old cookie answers 401', async () => {
    const client = await signedIn(t, DEMO.owner);
    const me = await client.get('/api/auth/me').expect(200);
    expect(me.body.household).toMatchObject({ role: 'owner' });
    expect(client.cookie).not.toBe('');
    await client.post('/api/auth/logout').expect(204);
    await client.get('/api/auth/me').expect(401);
    const replay = await t.http().get('/api/auth/me').set('Cookie', client.cookie);
    expect(replay.status).toBe(401);
  });

  it('refuses a write without the CSRF token with 403', async () => {
    const client = await signedIn(t, DEMO.owner);
    const res = await client.agent.post('/api/students').send({ name: 'Ivy', gradeLevel: '3' });
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/CSRF/);
    const wrong = await client.agent
      .post('/api/students')
      .set('x-csrf-token', 'forged')
      .send({ name: 'Ivy', gradeLevel: '3' });
    expect(wrong.status).toBe(403);
  });

  it('refuses a login without the CSRF token', async () => {
    const res = await t
      .http()
      .post('/api/auth/login')
      .send({ email: DEMO.owner, password: 'workback-demo' });
    expect(res.status).toBe(403);
  });

  it('marks the configured admin and gives them no household', async () => {
    const admin = await signedIn(t, DEMO.admin);
    const me = await admin.get('/api/auth/me').expect(200);
    expect(me.body.user.isAdmin).toBe(true);
    expect(me.body.household).toBeNull();
    const students = await admin.get('/api/students');
    expect(students.status).toBe(403);
  });
});

describe('throttling', () => {
  it('answers 429 after five sign-in attempts a minute for one e-mail', async () => {
    const client = new Client(t.http());
    await client.refreshToken();
    const statuses: number[] = [];
    for (let i = 0; i < 6; i += 1) {
      const res = await client.post('/api/auth/login', {
        email: 'throttled@example.test',
        password: `wrong-${i}`,
      });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses[5]).toBe(429);
  });
});
