import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SessionStoreService } from '../src/sessions/session-store.service.js';
import { outbox, waitForMail } from './support/mail.js';
import { Client, DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

// Small limits through configuration keep this fast (issue 13 §3).
let t: TestApp;

beforeAll(async () => {
  t = await startTestApp({
    SMTP_URL: '',
    SIGN_IN_LIMIT_PER_MINUTE: '1000',
    INVITATIONS_PER_HOUSEHOLD_PER_HOUR: '3',
    INVITATIONS_PER_ADDRESS_PER_DAY: '2',
    RESET_MAILS_PER_ADDRESS_PER_HOUR: '2',
  });
});
afterAll(() => t.close());

function sessionRows(): Promise<number> {
  return t.app.get(SessionStoreService).count();
}

describe('invitations', () => {
  it('limits invitations per recipient address, then per household, each with a 429', async () => {
    const owner = await signedIn(t, DEMO.owner);
    const invite = (email: string) => owner.post('/api/invitations', { email, role: 'parent' });
    expect((await invite('sprayed@example.test')).status).toBe(201);
    expect((await invite('sprayed@example.test')).status).toBe(201);
    const third = await invite('sprayed@example.test');
    expect(third.status).toBe(429);
    expect(third.body).toMatchObject({ statusCode: 429, error: 'Too Many Requests' });
    expect(third.body.message).toMatch(/That address has had 2 invitations today/);

    // The refused one did not count against the household: one more is allowed.
    expect((await invite('other@example.test')).status).toBe(201);
    const fourth = await invite('another@example.test');
    expect(fourth.status).toBe(429);
    expect(fourth.body.message).toMatch(/This household has sent 3 invitations in the last hour/);

    const open = await owner.get('/api/invitations').expect(200);
    const emails = (open.body.items as { email: string }[]).map((i) => i.email);
    expect(emails).not.toContain('another@example.test');
  });
});

describe('new-password mails', () => {
  it('limits reset requests per address, from any visitor, whether or not it has an account', async () => {
    const ask = async (email: string) => {
      const visitor = new Client(t.http());
      await visitor.refreshToken();
      return (await visitor.post('/api/auth/password-reset', { email })).status;
    };
    const statuses = [
      await ask(DEMO.parent),
      await ask(` ${DEMO.parent.toUpperCase()} `),
      await ask(DEMO.parent),
    ];
    expect(statuses).toEqual([202, 202, 429]);
    expect([await ask('nobody@example.test'), await ask('nobody@example.test')]).toEqual([
      202, 202,
    ]);
    expect(await ask('nobody@example.test')).toBe(429);

    const reader = await signedIn(t, DEMO.owner);
    await waitForMail(reader, DEMO.parent, /new Workback password/);
    await new Promise((r) => setTimeout(r, 200));
    const mails = (await outbox(reader)).filter(
      (m) => m.to === DEMO.parent && /new Workback password/.test(m.subject),
    );
    expect(mails).toHaveLength(2);
  });
});

describe('anonymous CSRF tokens', () => {
  it('stores no session row for visitors fetching a token', async () => {
    const before = await sessionRows();
    for (let i = 0; i < 100; i++) {
      const res = await t.http().get('/api/auth/csrf').expect(200);
      expect(res.body.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    }
    expect(await sessionRows()).toBe(before);
  });

  it('gives a visitor the same token while its cookie lasts', async () => {
    const visitor = new Client(t.http());
    const first = await visitor.refreshToken();
    expect(await visitor.refreshToken()).toBe(first);
  });

  it('refuses a sign-in with no token, a forged one, or one tied to another visitor', async () => {
    const body = { email: DEMO.owner, password: 'workback-demo' };
    const stranger = new Client(t.http());
    const strangersToken = await stranger.refreshToken();
    const visitor = new Client(t.http());
    await visitor.refreshToken();

    const none = await visitor.agent.post('/api/auth/login').send(body);
    expect(none.status).toBe(403);
    expect(none.body.message).toMatch(/CSRF/);
    const forged = await visitor.agent
      .post('/api/auth/login')
      .set('x-csrf-token', 'x'.repeat(43))
      .send(body);
    expect(forged.status).toBe(403);
    const borrowed = await visitor.agent
      .post('/api/auth/login')
      .set('x-csrf-token', strangersToken)
      .send(body);
    expect(borrowed.status).toBe(403);
    // The token without its cookie is worth nothing either.
    const cookieless = await t
      .http()
      .post('/api/auth/login')
      .set('x-csrf-token', strangersToken)
      .send(body);
    expect(cookieless.status).toBe(403);

    expect((await visitor.post('/api/auth/login', body)).status).toBe(200);
  });

  it('after sign-in wants the session token, not the visitor token', async () => {
    const client = new Client(t.http());
    const visitorToken = await client.refreshToken();
    const login = await client.post('/api/auth/login', {
      email: DEMO.owner,
      password: 'workback-demo',
    });
    expect(login.status).toBe(200);
    const stale = await client.post('/api/students', { name: 'Ivy', gradeLevel: '3' });
    expect(stale.status).toBe(403);
    const sessionToken = await client.refreshToken();
    expect(sessionToken).not.toBe(visitorToken);
    const rows = await sessionRows();
    expect(rows).toBeGreaterThan(0);
  });
});
