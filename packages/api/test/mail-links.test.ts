import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { linkPath, waitForMail } from './support/mail.js';
import {
  Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

// A forged Host (and a forwarded one, even behind a trusted proxy) must never decide where a
// mailed link points: that would hand reset and invitation tokens to the forger's server.
const FORGED = { Host: 'evil.example:8080', 'X-Forwarded-Host': 'evil.example' };

async function anonymous(t: TestApp): Promise<Client> {
  const c = new Client(t.http());
  await c.refreshToken();
  return c;
}

function originOf(t: TestApp): string {
  const { port } = t.app.getHttpServer().address() as { port: number };
  return `http://localhost:${port}`;
}

describe('links in development: the server’s own listening origin', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ SMTP_URL: '', PUBLIC_URL: '', TRUST_PROXY: 'true' });
  });
  afterAll(() => t.close());

  it('builds a reset link from where the server listens, not from Host or X-Forwarded-Host', async () => {
    await registered(t, 'forged-reset@example.test', 'Forged reset household');
    const c = await anonymous(t);
    await c
      .post('/api/auth/password-reset', { email: 'forged-reset@example.test' })
      .set(FORGED)
      .expect(202);
    const mail = await waitForMail(c, 'forged-reset@example.test', /new Workback password/);
    const link = mail.links.find((l) => l.includes('/reset-password/'))!;
    expect(new URL(link).origin).toBe(originOf(t));
    expect(mail.text + mail.html).not.toContain('evil.example');
  });

  it('builds an invitation link the same way', async () => {
    const owner = await signedIn(t, DEMO.owner);
    await owner
      .post('/api/invitations', { email: 'forged-invite@example.test', role: 'parent' })
      .set(FORGED)
      .expect(201);
    const mail = await waitForMail(owner, 'forged-invite@example.test', /invited you/);
    const link = mail.links.find((l) => l.includes('/invitations/'))!;
    expect(new URL(link).origin).toBe(originOf(t));
    expect(linkPath(mail, '/invitations/')).toMatch(/^\/invitations\/[A-Za-z0-9_-]{43}$/);
    expect(mail.text + mail.html).not.toContain('evil.example');
  });
});

describe('links with PUBLIC_URL set', () => {
  let t: TestApp;
  const PUBLIC_URL = 'https://workback.example.test/';
  beforeAll(async () => {
    t = await startTestApp({ SMTP_URL: '', PUBLIC_URL, TRUST_PROXY: 'true' });
  });
  afterAll(() => t.close());

  it('points reset, invitation and confirmation links at PUBLIC_URL whatever the headers say', async () => {
    await registered(t, 'public-reset@example.test', 'Public reset household');
    const c = await anonymous(t);
    await c
      .post('/api/auth/password-reset', { email: 'public-reset@example.test' })
      .set(FORGED)
      .expect(202);
    const reset = await waitForMail(c, 'public-reset@example.test', /new Workback password/);
    expect(
      reset.links.some((l) => l.startsWith('https://workback.example.test/reset-password/')),
    ).toBe(true);

    const owner = await signedIn(t, DEMO.owner);
    await owner
      .post('/api/invitations', { email: 'public-invite@example.test', role: 'parent' })
      .set(FORGED)
      .expect(201);
    const invite = await waitForMail(owner, 'public-invite@example.test', /invited you/);
    expect(
      invite.links.some((l) => l.startsWith('https://workback.example.test/invitations/')),
    ).toBe(true);

    const confirm = await waitForMail(c, 'public-reset@example.test', /Confirm your e-mail/);
    expect(
      confirm.links.some((l) => l.startsWith('https://workback.example.test/verify-email/')),
    ).toBe(true);
    for (const mail of [reset, invite, confirm]) {
      expect(mail.text + mail.html).not.toContain('evil.example');
    }
  });
});
