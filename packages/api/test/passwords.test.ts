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

// NIST SP 800-63B section 5.1.1.2: 8 characters at least, no composition rules, not blank,
// and not on a list of common passwords (here the 10,000 most common, see password-policy.ts).
const REFUSED: [string, RegExp][] = [
  ['password', /password is one of the 10,000 most common passwords/],
  ['12345678', /password is one of the 10,000 most common passwords/],
  ['Football', /password is one of the 10,000 most common passwords/],
  ['        ', /password must not be blank or only spaces/],
  ['short', /password must be 8 to 128 characters/],
];
const ACCEPTED = 'maple syrup on tuesdays';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ SMTP_URL: '', PUBLIC_URL: '', SIGN_IN_LIMIT_PER_MINUTE: '1000' });
});
afterAll(() => t.close());

async function anonymous(): Promise<Client> {
  const c = new Client(t.http());
  await c.refreshToken();
  return c;
}

const account = (email: string, password: string) => ({
  email,
  password,
  displayName: 'Pat',
  householdName: 'Pat household',
  adultConfirmed: true,
});

describe('new passwords follow NIST SP 800-63B', () => {
  it('on sign-up: refuses common, blank and short ones by field, and makes no account', async () => {
    const c = await anonymous();
    for (const [password, message] of REFUSED) {
      const res = await c.post('/api/auth/register', account('weak@example.test', password));
      expect(res.status, JSON.stringify(password)).toBe(400);
      expect(res.body.fields.password).toMatch(message);
    }
    const login = await c.post('/api/auth/login', { email: 'weak@example.test', password: 'x' });
    expect(login.status).toBe(401);
    const ok = await c.post('/api/auth/register', account('weak@example.test', ACCEPTED));
    expect(ok.status, ok.text).toBe(201);
  });

  it('on a password reset: refuses them and keeps the link usable', async () => {
    await registered(t, 'weak-reset@example.test', 'Weak reset household');
    const c = await anonymous();
    await c.post('/api/auth/password-reset', { email: 'weak-reset@example.test' }).expect(202);
    const mail = await waitForMail(c, 'weak-reset@example.test', /new Workback password/);
    const token = linkPath(mail, '/reset-password/').split('/').pop()!;
    for (const [password, message] of REFUSED) {
      const res = await c.post('/api/auth/password-reset/confirm', { token, password });
      expect(res.status, JSON.stringify(password)).toBe(400);
      expect(res.body.fields.password).toMatch(message);
    }
    await c.post('/api/auth/password-reset/confirm', { token, password: ACCEPTED }).expect(200);
    await signedIn(t, 'weak-reset@example.test', ACCEPTED);
  });

  it('on accepting an invitation as a new person: refuses them and keeps the invitation', async () => {
    const owner = await signedIn(t, DEMO.owner);
    await owner
      .post('/api/invitations', { email: 'weak-join@example.test', role: 'parent' })
      .expect(201);
    const mail = await waitForMail(owner, 'weak-join@example.test', /invited you/);
    const path = linkPath(mail, '/invitations/');
    const c = await anonymous();
    for (const [password, message] of REFUSED) {
      const res = await c.post(`/api${path}/accept`, { displayName: 'Jo', password });
      expect(res.status, JSON.stringify(password)).toBe(400);
      expect(res.body.fields.password).toMatch(message);
    }
    await c.get(`/api${path}`).expect(200);
    const res = await c.post(`/api${path}/accept`, { displayName: 'Jo', password: ACCEPTED });
    expect(res.status, res.text).toBe(200);
  });
});
