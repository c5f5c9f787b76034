import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DemoSeeder } from '../src/seed/demo-seeder.js';
import { linkPath, outbox, waitForMail } from './support/mail.js';
import {
  Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

const PASSWORD = 'a-long-enough-password';
let t: TestApp;

beforeAll(async () => {
  t = await startTestApp({
    SMTP_URL: '',
    PUBLIC_URL: '',
    SIGN_IN_LIMIT_PER_MINUTE: '1000',
    ADMIN_EMAILS: 'boss@example.test',
  });
});
afterAll(() => t.close());

async function anonymous(): Promise<Client> {
  const c = new Client(t.http());
  await c.refreshToken();
  return c;
}

const tokenOf = (path: string) => path.split('/').pop()!;

async function confirmationToken(c: Client, email: string, skip = 0): Promise<string> {
  const deadline = Date.now() + 5_000;
  for (;;) {
    const mails = (await outbox(c)).filter(
      (m) => m.to === email && /Confirm your e-mail/.test(m.subject),
    );
    if (mails.length > skip) return tokenOf(linkPath(mails[0]!, '/verify-email/'));
    if (Date.now() > deadline) throw new Error(`no confirmation mail ${skip + 1} to ${email}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

const me = async (c: Client) => (await c.get('/api/auth/me').expect(200)).body;
const sql = <T extends object>(query: string, replacements: unknown[] = []) =>
  t.app.get(Sequelize).query<T>(query, { type: QueryTypes.SELECT, replacements });

describe('a new account confirms its address', () => {
  it('is mailed a single-use link at sign-up and cannot invite until it is opened', async () => {
    const c = await registered(t, 'new-owner@example.test', 'New household');
    expect((await me(c)).user.emailVerified).toBe(false);
    const token = await confirmationToken(c, 'new-owner@example.test');

    const refused = await c.post('/api/invitations', { email: 'x@example.test', role: 'parent' });
    expect(refused.status).toBe(403);
    expect(refused.body.message).toMatch(/confirm your e-mail address before inviting/);
    expect((await outbox(c)).some((m) => m.to === 'x@example.test')).toBe(false);
    expect((await c.get('/api/invitations').expect(200)).body.total).toBe(0);

    // Only the sha256 of the token is stored, with an expiry.
    const rows = await sql<{ token_hash: string; expires_at: string }>(
      `SELECT t.token_hash, t.expires_at FROM email_verification_tokens t
         JOIN users u ON u.id = t.user_id WHERE u.email = ?`,
      ['new-owner@example.test'],
    );
    expect(rows).toHaveLength(1);
    expect(rows[0]!.token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(rows)).not.toContain(token);
    const hours = (new Date(rows[0]!.expires_at).getTime() - Date.now()) / 3_600_000;
    expect(hours).toBeGreaterThan(47);
    expect(hours).toBeLessThanOrEqual(48);

    // Opened in any browser, signed in or not.
    const visitor = await anonymous();
    const ok = await visitor.post('/api/auth/email-verification/confirm', { token });
    expect(ok.status, ok.text).toBe(200);
    expect(ok.body.email).toBe('new-owner@example.test');
    expect((await me(c)).user.emailVerified).toBe(true);

    const again = await visitor.post('/api/auth/email-verification/confirm', { token });
    expect(again.status).toBe(410);
    expect(again.body.message).toMatch(/already been used/);

    await c.post('/api/invitations', { email: 'x@example.test', role: 'parent' }).expect(201);
  });

  it('sends a new link on request; only the newest works; a confirmed address is not sent one', async () => {
    const c = await registered(t, 'resend@example.test', 'Resend household');
    const first = await confirmationToken(c, 'resend@example.test');
    const res = await c.post('/api/auth/email-verification');
    expect(res.status, res.text).toBe(202);
    const second = await confirmationToken(c, 'resend@example.test', 1);
    expect(second).not.toBe(first);

    const visitor = await anonymous();
    const old = await visitor.post('/api/auth/email-verification/confirm', { token: first });
    expect(old.status).toBe(404);
    await visitor.post('/api/auth/email-verification/confirm', { token: second }).expect(200);

    const done = await c.post('/api/auth/email-verification');
    expect(done.status).toBe(409);
    expect(done.body.message).toMatch(/already confirmed/);
    expect((await visitor.post('/api/auth/email-verification')).status).toBe(401);
  });

  it('refuses an expired link (410), a made-up one (404) and a bad body by field (400)', async () => {
    const c = await registered(t, 'late@example.test', 'Late household');
    const token = await confirmationToken(c, 'late@example.test');
    await t.app
      .get(Sequelize)
      .query(`UPDATE email_verification_tokens SET expires_at = ? WHERE token_hash = ?`, {
        replacements: [
          new Date(Date.now() - 1000).toISOString().replace('T', ' ').replace('Z', ' +00:00'),
          createHash('sha256').update(token).digest('hex'),
        ],
      });
    const visitor = await anonymous();
    const expired = await visitor.post('/api/auth/email-verification/confirm', { token });
    expect(expired.status).toBe(410);
    expect(expired.body.message).toMatch(/expired/);
    expect((await me(c)).user.emailVerified).toBe(false);

    const unknown = await visitor.post('/api/auth/email-verification/confirm', {
      token: 'A'.repeat(43),
    });
    expect(unknown.status).toBe(404);
    for (const body of [{}, { token: '' }, { token: 7 }, { token: 'x', extra: 1 }]) {
      const res = await visitor.post('/api/auth/email-verification/confirm', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(res.body.fields).length).toBeGreaterThan(0);
    }
  });

  it('seeds the demo accounts as confirmed', async () => {
    for (const email of [DEMO.owner, DEMO.parent, DEMO.tutor, DEMO.admin]) {
      expect((await me(await signedIn(t, email))).user.emailVerified, email).toBe(true);
    }
  });
});

describe('a demo seeded before addresses were confirmed', () => {
  it('has its accounts confirmed at the next start, and nobody else’s', async () => {
    const c = await registered(t, 'not-demo@example.test', 'Not the demo');
    const db = t.app.get(Sequelize);
    await db.query('UPDATE users SET email_verified_at = NULL WHERE email LIKE ?', {
      replacements: ['%@workback.test'],
    });
    expect((await me(await signedIn(t, DEMO.owner))).user.emailVerified).toBe(false);
    expect(await t.app.get(DemoSeeder).seedIfEmpty()).toBe(false);
    for (const email of [DEMO.owner, DEMO.parent, DEMO.tutor, DEMO.admin]) {
      expect((await me(await signedIn(t, email))).user.emailVerified, email).toBe(true);
    }
    expect((await me(c)).user.emailVerified).toBe(false);
  });
});

describe('ADMIN_EMAILS', () => {
  it('makes an address admin only once it is confirmed', async () => {
    const boss = await registered(t, 'boss@example.test', 'Boss household');
    expect((await me(boss)).user.isAdmin).toBe(false);
    expect((await boss.get('/api/admin/metrics')).status).toBe(403);
    const token = await confirmationToken(boss, 'boss@example.test');
    await (await anonymous()).post('/api/auth/email-verification/confirm', { token }).expect(200);
    expect((await me(boss)).user.isAdmin).toBe(true);
    expect((await boss.get('/api/admin/metrics')).status).toBe(200);
  });
});

describe('accepting an invitation', () => {
  async function invite(email: string): Promise<string> {
    const owner = await signedIn(t, DEMO.owner);
    await owner.post('/api/invitations', { email, role: 'parent' }).expect(201);
    const mail = await waitForMail(owner, email, /invited you/);
    return linkPath(mail, '/invitations/');
  }

  it('confirms a new account made with the invited address (the link proved it)', async () => {
    const path = await invite('joiner@example.test');
    const c = await anonymous();
    const res = await c.post(`/api${path}/accept`, { displayName: 'Jo', password: PASSWORD });
    expect(res.status, res.text).toBe(200);
    expect(res.body.user).toMatchObject({ email: 'joiner@example.test', emailVerified: true });
    await new Promise((r) => setTimeout(r, 100));
    expect(
      (await outbox(c)).some(
        (m) => m.to === 'joiner@example.test' && /Confirm your e-mail/.test(m.subject),
      ),
    ).toBe(false);
  });

  it('mails a confirmation link to another address chosen for the new account', async () => {
    const path = await invite('invited-here@example.test');
    const c = await anonymous();
    const res = await c.post(`/api${path}/accept`, {
      displayName: 'Jo',
      password: PASSWORD,
      email: 'chosen-there@example.test',
    });
    expect(res.status, res.text).toBe(200);
    expect(res.body.user).toMatchObject({
      email: 'chosen-there@example.test',
      emailVerified: false,
    });
    await confirmationToken(c, 'chosen-there@example.test');
  });

  it('with an e-mail that has an account: does not say so, keeps the invitation, lets its owner join', async () => {
    await registered(t, 'has-account@example.test', 'Own household');
    const path = await invite('has-account@example.test');
    const visitor = await anonymous();
    const wrong = await visitor.post(`/api${path}/accept`, {
      displayName: 'Someone',
      password: 'not-their-password',
    });
    expect(wrong.status).toBe(401);
    expect(wrong.body.message).toMatch(/sign in first/);
    expect(wrong.text).not.toMatch(/already|exists/i);
    expect(Object.keys(wrong.body.fields).sort()).toEqual(['email', 'password']);
    // The same answer for an address chosen in the body.
    const chosen = await visitor.post(`/api${path}/accept`, {
      displayName: 'Someone',
      password: 'not-their-password',
      email: DEMO.tutor,
    });
    expect(chosen.status).toBe(401);
    expect(chosen.body).toEqual(wrong.body);
    // Not used up: still pending for its owner.
    expect((await visitor.get(`/api${path}`)).status).toBe(200);

    // The owner of that address signs in and joins.
    const owner = await signedIn(t, 'has-account@example.test', PASSWORD);
    const joined = await owner.post(`/api${path}/accept`, {});
    expect(joined.status, joined.text).toBe(200);
    expect(joined.body.households.map((h: { name: string }) => h.name).sort()).toEqual([
      'Own household',
      'The Hollow Lane household',
    ]);
    expect((await visitor.get(`/api${path}`)).status).toBe(410);
  });

  it('with that account’s password: joins as that account, as if signed in first', async () => {
    await registered(t, 'knows-password@example.test', 'Password household');
    const path = await invite('knows-password@example.test');
    const c = await anonymous();
    const res = await c.post(`/api${path}/accept`, { displayName: 'Ignored', password: PASSWORD });
    expect(res.status, res.text).toBe(200);
    expect(res.body.user).toMatchObject({
      email: 'knows-password@example.test',
      displayName: 'Tester',
    });
    expect(res.body.household.name).toBe('The Hollow Lane household');
    await c.refreshToken();
    expect((await me(c)).user.email).toBe('knows-password@example.test');
    const users = await sql<{ n: number }>('SELECT COUNT(*) AS n FROM users WHERE email = ?', [
      'knows-password@example.test',
    ]);
    expect(Number(users[0]!.n)).toBe(1);
  });
});
