import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { linkPath, outbox, waitForMail } from './support/mail.js';
import { Client, registered, signedIn, startTestApp, type TestApp } from './support/test-app.js';

let t: TestApp;

beforeAll(async () => {
  t = await startTestApp({ SMTP_URL: '', SIGN_IN_LIMIT_PER_MINUTE: '1000' });
});
afterAll(() => t.close());

async function anonymous(): Promise<Client> {
  const c = new Client(t.http());
  await c.refreshToken();
  return c;
}

const tokenOf = (path: string) => path.split('/').pop()!;

describe('asking for a reset', () => {
  it('answers 202 with the same body for a known and an unknown address, mailing only the known', async () => {
    await registered(t, 'forgetful@example.test', 'Reset household');
    const c = await anonymous();
    const known = await c.post('/api/auth/password-reset', { email: 'Forgetful@Example.test' });
    const unknown = await c.post('/api/auth/password-reset', { email: 'nobody@example.test' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    const mail = await waitForMail(c, 'forgetful@example.test', /new Workback password/);
    expect(linkPath(mail, '/reset-password/')).toMatch(/^\/reset-password\/[A-Za-z0-9_-]{43}$/);
    expect(mail.text).toMatch(/one hour/);
    expect(mail.text).toMatch(/because a new password was asked for/);
    await new Promise((r) => setTimeout(r, 200));
    expect((await outbox(c)).some((m) => m.to === 'nobody@example.test')).toBe(false);
  });

  it('names a bad e-mail field', async () => {
    const res = await (await anonymous()).post('/api/auth/password-reset', { email: 'nope' });
    expect(res.status).toBe(400);
    expect(res.body.fields).toHaveProperty('email');
  });
});

describe('setting the new password', () => {
  it('works end to end: new password signs in, the old does not, other sessions end, the link is single use', async () => {
    await registered(t, 'reset-me@example.test', 'Another reset household');
    const elsewhere = await signedIn(t, 'reset-me@example.test', 'a-long-enough-password');
    await elsewhere.get('/api/students').expect(200);

    const c = await anonymous();
    await c.post('/api/auth/password-reset', { email: 'reset-me@example.test' }).expect(202);
    const mail = await waitForMail(c, 'reset-me@example.test', /new Workback password/);
    const token = tokenOf(linkPath(mail, '/reset-password/'));
    const rows = await t.app
      .get(Sequelize)
      .query<{ token_hash: string }>('SELECT token_hash FROM password_reset_tokens', {
        type: QueryTypes.SELECT,
      });
    expect(rows.some((r) => r.token_hash === token)).toBe(false);

    const short = await c.post('/api/auth/password-reset/confirm', { token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.fields.password).toMatch(/8 to 128/);

    const ok = await c.post('/api/auth/password-reset/confirm', {
      token,
      password: 'a-brand-new-password',
    });
    expect(ok.status).toBe(200);
    expect((await elsewhere.get('/api/students')).status).toBe(401);
    expect(
      (await new Client(t.http()).signIn('reset-me@example.test', 'a-long-enough-password')).status,
    ).toBe(401);
    await signedIn(t, 'reset-me@example.test', 'a-brand-new-password');

    const again = await c.post('/api/auth/password-reset/confirm', {
      token,
      password: 'yet-another-password',
    });
    expect(again.status).toBe(410);
    expect(again.body.message).toMatch(/already been used/);
  });

  it('only the newest link works, an expired one answers 410 and an unknown one 404', async () => {
    await registered(t, 'twice-reset@example.test', 'Third reset household');
    const c = await anonymous();
    await c.post('/api/auth/password-reset', { email: 'twice-reset@example.test' }).expect(202);
    const first = tokenOf(
      linkPath(await waitForMail(c, 'twice-reset@example.test', /password/), '/reset-password/'),
    );
    await c.post('/api/auth/password-reset', { email: 'twice-reset@example.test' }).expect(202);
    let second = first;
    for (let i = 0; i < 100 && second === first; i++) {
      const mails = (await outbox(c)).filter((m) => m.to === 'twice-reset@example.test');
      second = tokenOf(linkPath(mails[0]!, '/reset-password/'));
      if (second === first) await new Promise((r) => setTimeout(r, 50));
    }
    expect(second).not.toBe(first);
    expect(
      (
        await c.post('/api/auth/password-reset/confirm', {
          token: first,
          password: 'first-link-password',
        })
      ).status,
    ).toBe(404);

    await t.app.get(Sequelize).query('UPDATE password_reset_tokens SET expires_at = ?', {
      replacements: [new Date(Date.now() - 1000)],
    });
    const late = await c.post('/api/auth/password-reset/confirm', {
      token: second,
      password: 'too-late-password',
    });
    expect(late.status).toBe(410);
    expect(late.body.message).toMatch(/expired/);
    expect(
      (
        await c.post('/api/auth/password-reset/confirm', {
          token: 'nonsense',
          password: 'whatever-long',
        })
      ).status,
    ).toBe(404);
    await signedIn(t, 'twice-reset@example.test', 'a-long-enough-password');
  });
});
