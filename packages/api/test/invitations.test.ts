import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { linkPath, outbox, waitForMail } from './support/mail.js';
import {
  Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

let t: TestApp;
let owner: Client;
let wren: number;
let milo: number;

beforeAll(async () => {
  t = await startTestApp({
    SMTP_URL: '',
    SIGN_IN_LIMIT_PER_MINUTE: '1000',
    // This file sends more invitations than a household may in an hour, and than an address may
    // get in a day (abuse-limits tests both).
    INVITATIONS_PER_HOUSEHOLD_PER_HOUR: '1000',
    INVITATIONS_PER_ADDRESS_PER_DAY: '1000',
  });
  owner = await signedIn(t, DEMO.owner);
  const students = (await owner.get('/api/students').expect(200)).body.items as {
    id: number;
    name: string;
  }[];
  wren = students.find((s) => s.name === 'Wren')!.id;
  milo = students.find((s) => s.name === 'Milo')!.id;
});
afterAll(() => t.close());

const db = () => t.app.get(Sequelize);

/** Invites, then reads the acceptance path from the captured mail, as a person would. */
async function invite(
  by: Client,
  body: { email: string; role: string; studentIds?: number[] },
): Promise<string> {
  const res = await by.post('/api/invitations', body);
  expect(res.status, res.text).toBe(201);
  const mail = await waitForMail(by, body.email, /invited you/);
  const path = linkPath(mail, '/invitations/');
  expect(path).toMatch(/^\/invitations\/[A-Za-z0-9_-]{43}$/);
  return path;
}

async function anonymous(): Promise<Client> {
  const c = new Client(t.http());
  await c.refreshToken();
  return c;
}

describe('inviting', () => {
  it('answers the invitation without its token, and mails the link', async () => {
    const res = await owner.post('/api/invitations', {
      email: ' Tutor.Two@Example.test ',
      role: 'tutor',
      studentIds: [wren],
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      email: 'tutor.two@example.test',
      role: 'tutor',
      studentIds: [wren],
      status: 'pending',
      invitedBy: { displayName: 'Robin' },
    });
    expect(JSON.stringify(res.body)).not.toMatch(/token/i);
    const days = (new Date(res.body.expiresAt).getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThanOrEqual(7);
    const mail = await waitForMail(owner, 'tutor.two@example.test', /invited you/);
    expect(mail.subject).toBe('Robin invited you to The Hollow Lane household on Workback');
    // Only the hash is stored: the token from the mail is nowhere in the database.
    const token = linkPath(mail, '/invitations/').split('/').pop()!;
    const rows = await db().query<{ token_hash: string }>('SELECT token_hash FROM invitations', {
      type: QueryTypes.SELECT,
    });
    expect(rows.some((r) => r.token_hash.includes(token))).toBe(false);
    expect(rows.every((r) => /^[0-9a-f]{64}$/.test(r.token_hash))).toBe(true);
    const list = await owner.get('/api/invitations').expect(200);
    expect(list.body.items.map((i: { email: string }) => i.email)).toContain(
      'tutor.two@example.test',
    );
  });

  it('requires at least one granted student of this household for a tutor', async () => {
    const none = await owner.post('/api/invitations', { email: 'a@example.test', role: 'tutor' });
    expect(none.status).toBe(400);
    expect(none.body.fields.studentIds).toMatch(/at least one student/);
    const empty = await owner.post('/api/invitations', {
      email: 'a@example.test',
      role: 'tutor',
      studentIds: [],
    });
    expect(empty.status).toBe(400);
    const stranger = await registered(t, 'other-owner@example.test', 'Other household');
    const theirs = await stranger.post('/api/students', { name: 'Theirs', gradeLevel: '3' });
    const foreign = await owner.post('/api/invitations', {
      email: 'a@example.test',
      role: 'tutor',
      studentIds: [theirs.body.id],
    });
    expect(foreign.status).toBe(404);
    const mailed = (await outbox(owner)).filter((m) => m.to === 'a@example.test');
    expect(mailed).toHaveLength(0);
  });

  it('refuses bad fields by name and leaves no row', async () => {
    const before = (await owner.get('/api/invitations').expect(200)).body.total;
    const cases: [object, string][] = [
      [{ email: 'not-an-email', role: 'parent' }, 'email'],
      [{ email: 'p@example.test', role: 'owner' }, 'role'],
      [{ email: 'p@example.test', role: 'parent', studentIds: [wren] }, 'studentIds'],
      [{ email: 'p@example.test', role: 'tutor', studentIds: ['x'] }, 'studentIds'],
      [{ email: 'p@example.test', role: 'parent', admin: true }, 'admin'],
    ];
    for (const [body, field] of cases) {
      const res = await owner.post('/api/invitations', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.fields).toHaveProperty(field);
    }
    expect((await owner.get('/api/invitations').expect(200)).body.total).toBe(before);
  });

  it('refuses to invite someone already in the household (409)', async () => {
    const res = await owner.post('/api/invitations', { email: DEMO.parent, role: 'parent' });
    expect(res.status).toBe(409);
    expect(res.body.fields).toHaveProperty('email');
  });

  it('lets a second parent invite, and not a tutor or the site admin', async () => {
    const parent = await signedIn(t, DEMO.parent);
    await invite(parent, { email: 'by-parent@example.test', role: 'parent' });
    const tutor = await signedIn(t, DEMO.tutor);
    const res = await tutor.post('/api/invitations', { email: 'x@example.test', role: 'parent' });
    expect(res.status).toBe(403);
    expect((await tutor.get('/api/invitations')).status).toBe(403);
    const admin = await signedIn(t, DEMO.admin);
    expect(
      (await admin.post('/api/invitations', { email: 'x@example.test', role: 'parent' })).status,
    ).toBe(403);
  });

  it('replaces an earlier open invitation to the same address', async () => {
    const first = await invite(owner, { email: 'twice@example.test', role: 'parent' });
    await new Promise((r) => setTimeout(r, 5));
    await invite(owner, { email: 'twice@example.test', role: 'parent' });
    const anon = await anonymous();
    expect((await anon.get(`/api${first}`)).status).toBe(404);
    const open = (await owner.get('/api/invitations').expect(200)).body.items.filter(
      (i: { email: string }) => i.email === 'twice@example.test',
    );
    expect(open).toHaveLength(1);
  });

  it('keeps the newest of five invitations sent at once to one address, and its mailed link works', async () => {
    const email = 'five-at-once@example.test';
    // Without the "older than the new one" rule each removed every other open invitation to the
    // address, the others' new ones too, so no mailed link worked.
    const sent = await Promise.all(
      Array.from({ length: 5 }, () => owner.post('/api/invitations', { email, role: 'parent' })),
    );
    expect(sent.map((r) => `${r.status} ${r.status === 201 ? '' : r.text}`)).toEqual(
      Array(5).fill('201 '),
    );
    const newest = Math.max(...sent.map((r) => r.body.id as number));
    const open = (await owner.get('/api/invitations').expect(200)).body.items.filter(
      (i: { email: string }) => i.email === email,
    );
    expect(open.map((i: { id: number }) => i.id)).toEqual([newest]);

    const mailed = (await outbox(owner)).filter((m) => m.to === email);
    expect(mailed).toHaveLength(5);
    const anon = await anonymous();
    const previews = await Promise.all(
      mailed.map(async (m) => ({
        path: linkPath(m, '/invitations/'),
        status: (await anon.get(`/api${linkPath(m, '/invitations/')}`)).status,
      })),
    );
    expect(previews.map((p) => p.status).sort()).toEqual([200, 404, 404, 404, 404]);
    const working = previews.find((p) => p.status === 200)!.path;
    await anon
      .post(`/api${working}/accept`, { displayName: 'Five', password: 'a-good-long-password' })
      .expect(200);
    expect((await owner.get('/api/members').expect(200)).body.items).toContainEqual(
      expect.objectContaining({ email, role: 'parent' }),
    );
  });
});

describe('accepting', () => {
  it('creates the account of a new person, signs them in and shows only the granted child', async () => {
    const path = await invite(owner, {
      email: 'new.tutor@example.test',
      role: 'tutor',
      studentIds: [wren],
    });
    const visitor = await anonymous();
    const preview = await visitor.get(`/api${path}`).expect(200);
    expect(preview.body).toMatchObject({
      email: 'new.tutor@example.test',
      role: 'tutor',
      householdName: 'The Hollow Lane household',
      invitedByName: 'Robin',
    });
    const res = await visitor.post(`/api${path}/accept`, {
      displayName: 'Sam',
      password: 'a-good-long-password',
    });
    expect(res.status, res.text).toBe(200);
    expect(res.body.user).toMatchObject({ email: 'new.tutor@example.test', displayName: 'Sam' });
    expect(res.body.household).toMatchObject({ name: 'The Hollow Lane household', role: 'tutor' });
    await visitor.refreshToken();
    const students = await visitor.get('/api/students').expect(200);
    expect(students.body.items.map((s: { id: number }) => s.id)).toEqual([wren]);
    await visitor.get(`/api/students/${milo}`).expect(404);
    // The new password works for a fresh sign-in.
    await signedIn(t, 'new.tutor@example.test', 'a-good-long-password');
  });

  it('works once only: a second use answers 410 and changes nothing', async () => {
    const path = await invite(owner, { email: 'once@example.test', role: 'parent' });
    const first = await anonymous();
    await first
      .post(`/api${path}/accept`, { displayName: 'Once', password: 'a-good-long-password' })
      .expect(200);
    const second = await anonymous();
    const again = await second.post(`/api${path}/accept`, {
      displayName: 'Twice',
      password: 'another-long-password',
      email: 'twice-account@example.test',
    });
    expect(again.status).toBe(410);
    expect(again.body).toMatchObject({ statusCode: 410, error: 'Gone' });
    expect(again.body.message).toMatch(/already been used/);
    const login = await new Client(t.http()).signIn(
      'twice-account@example.test',
      'another-long-password',
    );
    expect(login.status).toBe(401);
  });

  it('answers 410 for an expired link and 404 for an unknown one', async () => {
    const path = await invite(owner, { email: 'late@example.test', role: 'parent' });
    await db().query("UPDATE invitations SET expires_at = ? WHERE email = 'late@example.test'", {
      replacements: [new Date(Date.now() - 60_000)],
    });
    const visitor = await anonymous();
    const late = await visitor.post(`/api${path}/accept`, {
      displayName: 'Late',
      password: 'a-good-long-password',
    });
    expect(late.status).toBe(410);
    expect(late.body.message).toMatch(/expired/);
    expect((await visitor.get(`/api${path}`)).status).toBe(410);
    const unknown = await visitor.post(`/api/invitations/${'x'.repeat(43)}/accept`, {
      displayName: 'Who',
      password: 'a-good-long-password',
    });
    expect(unknown.status).toBe(404);
    expect(unknown.body.message).toMatch(/not valid/);
    expect((await visitor.post('/api/invitations/short/accept', {})).status).toBe(404);
  });

  it('names the missing fields of a new person, and asks an e-mail that has an account to sign in', async () => {
    const path = await invite(owner, { email: 'fields@example.test', role: 'parent' });
    const visitor = await anonymous();
    const missing = await visitor.post(`/api${path}/accept`, {});
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.fields).sort()).toEqual(['displayName', 'password']);
    const short = await visitor.post(`/api${path}/accept`, { displayName: 'F', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.fields.password).toMatch(/8 to 128/);
    const taken = await visitor.post(`/api${path}/accept`, {
      displayName: 'F',
      password: 'a-good-long-password',
      email: DEMO.tutor,
    });
    // As for any acceptance that needs a sign-in, without saying the address has an account.
    expect(taken.status).toBe(401);
    expect(taken.body.fields).toHaveProperty('email');
    expect(taken.text).not.toMatch(/already|exists/i);
    // Still usable after those refusals.
    await visitor
      .post(`/api${path}/accept`, { displayName: 'F', password: 'a-good-long-password' })
      .expect(200);
  });

  it('adds a signed-in user of another household, who can then switch between the two', async () => {
    const other = await registered(t, 'two-homes@example.test', 'The Ridge household');
    const path = await invite(owner, {
      email: 'two-homes@example.test',
      role: 'tutor',
      studentIds: [milo],
    });
    const res = await other.post(`/api${path}/accept`, {});
    expect(res.status, res.text).toBe(200);
    expect(res.body.households.map((h: { name: string }) => h.name).sort()).toEqual([
      'The Hollow Lane household',
      'The Ridge household',
    ]);
    expect(res.body.household.name).toBe('The Hollow Lane household');
    const here = (await other.get('/api/households/current').expect(200)).body;
    expect(here).toMatchObject({ name: 'The Hollow Lane household', role: 'tutor' });
    expect(
      (await other.get('/api/students').expect(200)).body.items.map((s: { id: number }) => s.id),
    ).toEqual([milo]);

    const ridge = res.body.households.find(
      (h: { name: string }) => h.name === 'The Ridge household',
    );
    const back = await other.post('/api/households/current', { householdId: ridge.id });
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ id: ridge.id, name: 'The Ridge household', role: 'owner' });
    expect((await other.get('/api/students').expect(200)).body.total).toBe(0);
    expect((await other.get('/api/auth/me').expect(200)).body.household.name).toBe(
      'The Ridge household',
    );

    const hollow = res.body.households.find(
      (h: { name: string }) => h.name !== 'The Ridge household',
    );
    await other.post('/api/households/current', { householdId: hollow.id }).expect(200);
    expect(
      (await other.get('/api/students').expect(200)).body.items.map((s: { id: number }) => s.id),
    ).toEqual([milo]);

    const accepting = await other.post(`/api${path}/accept`, {});
    expect(accepting.status).toBe(410);
  });

  it('refuses switching to a household that is not yours (404) and bad ids (400)', async () => {
    const stranger = await registered(t, 'switcher@example.test', 'Lone household');
    const me = (await owner.get('/api/households/current').expect(200)).body;
    const res = await stranger.post('/api/households/current', { householdId: me.id });
    expect(res.status).toBe(404);
    const bad = await stranger.post('/api/households/current', { householdId: 'one' });
    expect(bad.status).toBe(400);
    expect(bad.body.fields).toHaveProperty('householdId');
    expect((await stranger.get('/api/households/current').expect(200)).body.name).toBe(
      'Lone household',
    );
  });

  it('refuses a signed-in member of the same household (409) and a signed-in user sending a password (400)', async () => {
    const path = await invite(owner, { email: 'someone-else@example.test', role: 'parent' });
    const parent = await signedIn(t, DEMO.parent);
    expect((await parent.post(`/api${path}/accept`, {})).status).toBe(409);
    const withPassword = await parent.post(`/api${path}/accept`, {
      password: 'a-good-long-password',
    });
    expect(withPassword.status).toBe(400);
    expect(withPassword.body.fields).toHaveProperty('password');
  });

  it('can be withdrawn before it is used', async () => {
    const path = await invite(owner, { email: 'withdrawn@example.test', role: 'parent' });
    const open = (await owner.get('/api/invitations').expect(200)).body.items.find(
      (i: { email: string }) => i.email === 'withdrawn@example.test',
    );
    await owner.send('delete', `/api/invitations/${open.id}`).expect(204);
    const visitor = await anonymous();
    expect(
      (
        await visitor.post(`/api${path}/accept`, {
          displayName: 'W',
          password: 'a-good-long-password',
        })
      ).status,
    ).toBe(404);
    const stranger = await registered(t, 'withdraw-stranger@example.test', 'Far household');
    const another = await owner.post('/api/invitations', {
      email: 'keep@example.test',
      role: 'parent',
    });
    expect((await stranger.send('delete', `/api/invitations/${another.body.id}`)).status).toBe(404);
  });
});
