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

interface Member {
  id: number;
  userId: number;
  email: string;
  displayName: string;
  role: string;
  studentIds: number[] | null;
  isYou: boolean;
}

let t: TestApp;
let owner: Client;
let wren: number;
let milo: number;

beforeAll(async () => {
  t = await startTestApp({ SMTP_URL: '', SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  const students = (await owner.get('/api/students').expect(200)).body.items as {
    id: number;
    name: string;
  }[];
  wren = students.find((s) => s.name === 'Wren')!.id;
  milo = students.find((s) => s.name === 'Milo')!.id;
});
afterAll(() => t.close());

async function members(by: Client = owner): Promise<Member[]> {
  return (await by.get('/api/members').expect(200)).body.items as Member[];
}

const byEmail = async (email: string) => (await members()).find((m) => m.email === email)!;

/** A fresh tutor of the demo household through the real invitation flow. */
async function newTutor(email: string, studentIds: number[]): Promise<Client> {
  await owner.post('/api/invitations', { email, role: 'tutor', studentIds }).expect(201);
  const mail = await waitForMail(owner, email, /invited you/);
  const c = new Client(t.http());
  await c.refreshToken();
  await c
    .post(`/api${linkPath(mail, '/invitations/')}/accept`, {
      displayName: 'Helper',
      password: 'a-good-long-password',
    })
    .expect(200);
  await c.refreshToken();
  return c;
}

describe('listing', () => {
  it('lists the household’s members with roles and a tutor’s students', async () => {
    const list = await members();
    expect(list.map((m) => [m.email, m.role]).sort()).toEqual(
      [
        [DEMO.owner, 'owner'],
        [DEMO.parent, 'parent'],
        [DEMO.tutor, 'tutor'],
      ].sort(),
    );
    expect(list.find((m) => m.email === DEMO.tutor)!.studentIds).toEqual([wren]);
    expect(list.find((m) => m.email === DEMO.parent)!.studentIds).toBeNull();
    expect(list.find((m) => m.email === DEMO.owner)!.isYou).toBe(true);
    const one = await owner.get(`/api/members/${list[0]!.id}`).expect(200);
    expect(one.body).toEqual(JSON.parse(JSON.stringify(list[0])));
  });

  it('is for owners and parents: a tutor and the site admin get 403', async () => {
    const tutor = await signedIn(t, DEMO.tutor);
    expect((await tutor.get('/api/members')).status).toBe(403);
    const admin = await signedIn(t, DEMO.admin);
    expect((await admin.get('/api/members')).status).toBe(403);
    const parent = await signedIn(t, DEMO.parent);
    expect((await members(parent)).length).toBeGreaterThanOrEqual(3);
  });

  it('answers 404 for another household’s member ids, on every verb', async () => {
    const stranger = await registered(t, 'members-stranger@example.test', 'Elsewhere');
    const theirOwner = (await members(stranger))[0]!;
    await owner.get(`/api/members/${theirOwner.id}`).expect(404);
    await owner.send('patch', `/api/members/${theirOwner.id}`, { role: 'parent' }).expect(404);
    await owner.send('delete', `/api/members/${theirOwner.id}`).expect(404);
    const mine = await byEmail(DEMO.parent);
    await stranger.get(`/api/members/${mine.id}`).expect(404);
    expect((await owner.get('/api/members/abc')).body.fields).toHaveProperty('id');
  });
});

describe('changing', () => {
  it('changes a tutor’s students, and the tutor sees the new set on the next request', async () => {
    const tutor = await newTutor('swap@example.test', [wren]);
    expect(
      (await tutor.get('/api/students').expect(200)).body.items.map((s: { id: number }) => s.id),
    ).toEqual([wren]);
    const m = await byEmail('swap@example.test');
    const res = await owner.send('patch', `/api/members/${m.id}`, { studentIds: [milo] });
    expect(res.status).toBe(200);
    expect(res.body.studentIds).toEqual([milo]);
    expect(
      (await tutor.get('/api/students').expect(200)).body.items.map((s: { id: number }) => s.id),
    ).toEqual([milo]);
    await tutor.get(`/api/students/${wren}`).expect(404);
  });

  it('changes a tutor’s students sent six times at once (a second tap, two parents) once, answering each', async () => {
    const tutor = await newTutor('grants-at-once@example.test', [wren]);
    const m = await byEmail('grants-at-once@example.test');
    // On PostgreSQL, without the membership's row lock, all but the first failed 409 on the
    // grants' primary key: the role was unchanged, so nothing held the row while each deleted
    // the grants it saw and inserted the new ones.
    const changes = await Promise.all(
      Array.from({ length: 6 }, () =>
        owner.send('patch', `/api/members/${m.id}`, { studentIds: [milo, wren] }),
      ),
    );
    expect(changes.map((r) => `${r.status} ${r.status === 200 ? '' : r.text}`)).toEqual(
      Array(6).fill('200 '),
    );
    const both = [milo, wren].sort((a, b) => a - b);
    for (const r of changes) expect(r.body).toMatchObject({ role: 'tutor', studentIds: both });
    expect((await byEmail('grants-at-once@example.test')).studentIds).toEqual(both);
    expect(
      (await tutor.get('/api/students').expect(200)).body.items
        .map((s: { id: number }) => s.id)
        .sort((a: number, b: number) => a - b),
    ).toEqual(both);
  });

  it('refuses an empty grant, a foreign student, students for a parent, and an empty body', async () => {
    const m = await byEmail(DEMO.tutor);
    const empty = await owner.send('patch', `/api/members/${m.id}`, { studentIds: [] });
    expect(empty.status).toBe(400);
    expect(empty.body.fields).toHaveProperty('studentIds');
    const stranger = await registered(t, 'grant-stranger@example.test', 'Far away');
    const theirs = await stranger.post('/api/students', { name: 'Far', gradeLevel: '1' });
    expect(
      (await owner.send('patch', `/api/members/${m.id}`, { studentIds: [theirs.body.id] })).status,
    ).toBe(404);
    const parent = await byEmail(DEMO.parent);
    const forParent = await owner.send('patch', `/api/members/${parent.id}`, {
      studentIds: [wren],
    });
    expect(forParent.status).toBe(400);
    expect(forParent.body.fields).toHaveProperty('studentIds');
    expect((await owner.send('patch', `/api/members/${m.id}`, {})).status).toBe(400);
    expect(
      (await owner.send('patch', `/api/members/${m.id}`, { role: 'admin' })).body.fields,
    ).toHaveProperty('role');
    expect((await byEmail(DEMO.tutor)).studentIds).toEqual([wren]);
  });

  it('turns a tutor into a parent (who then sees every student) and back with students', async () => {
    const tutor = await newTutor('promote@example.test', [wren]);
    const m = await byEmail('promote@example.test');
    const up = await owner.send('patch', `/api/members/${m.id}`, { role: 'parent' });
    expect(up.body).toMatchObject({ role: 'parent', studentIds: null });
    expect((await tutor.get('/api/students').expect(200)).body.total).toBe(2);
    const noStudents = await owner.send('patch', `/api/members/${m.id}`, { role: 'tutor' });
    expect(noStudents.status).toBe(400);
    const down = await owner.send('patch', `/api/members/${m.id}`, {
      role: 'tutor',
      studentIds: [milo],
    });
    expect(down.body).toMatchObject({ role: 'tutor', studentIds: [milo] });
    expect(
      (await tutor.get('/api/students').expect(200)).body.items.map((s: { id: number }) => s.id),
    ).toEqual([milo]);
  });

  it('keeps the owner’s powers with owners', async () => {
    const parent = await signedIn(t, DEMO.parent);
    const ownerRow = await byEmail(DEMO.owner);
    expect(
      (await parent.send('patch', `/api/members/${ownerRow.id}`, { role: 'parent' })).status,
    ).toBe(403);
    const me = await byEmail(DEMO.parent);
    expect((await parent.send('patch', `/api/members/${me.id}`, { role: 'owner' })).status).toBe(
      403,
    );
    const last = await owner.send('patch', `/api/members/${ownerRow.id}`, { role: 'parent' });
    expect(last.status).toBe(409);
    expect(last.body.message).toMatch(/needs an owner/);
    const tutor = await signedIn(t, DEMO.tutor);
    expect((await tutor.send('patch', `/api/members/${me.id}`, { role: 'tutor' })).status).toBe(
      403,
    );
  });
});

describe('revoking', () => {
  it('takes effect on the very next request', async () => {
    const tutor = await newTutor('revoked@example.test', [wren]);
    await tutor.get('/api/students').expect(200);
    const m = await byEmail('revoked@example.test');
    await owner.send('delete', `/api/members/${m.id}`).expect(204);
    const after = await tutor.get('/api/students');
    expect(after.status).toBe(403);
    expect(after.body.message).toMatch(/not a member/);
    await tutor.get(`/api/students/${wren}`).expect(403);
    expect((await members()).some((x) => x.email === 'revoked@example.test')).toBe(false);
  });

  it('lets a parent remove a tutor but never the owner; nobody removes the last owner', async () => {
    const parent = await signedIn(t, DEMO.parent);
    await newTutor('parent-removes@example.test', [milo]);
    const m = await byEmail('parent-removes@example.test');
    await parent.send('delete', `/api/members/${m.id}`).expect(204);
    const ownerRow = await byEmail(DEMO.owner);
    const res = await parent.send('delete', `/api/members/${ownerRow.id}`);
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/may not change or remove the owner/);
    expect((await owner.send('delete', `/api/members/${ownerRow.id}`)).status).toBe(409);
    const tutor = await signedIn(t, DEMO.tutor);
    expect((await tutor.send('delete', `/api/members/${m.id}`)).status).toBe(403);
    expect((await byEmail(DEMO.owner)).role).toBe('owner');
  });

  it('lets an owner hand over: make a parent owner, then step down', async () => {
    const parentRow = await byEmail(DEMO.parent);
    await owner.send('patch', `/api/members/${parentRow.id}`, { role: 'owner' }).expect(200);
    const ownerRow = await byEmail(DEMO.owner);
    const down = await owner.send('patch', `/api/members/${ownerRow.id}`, { role: 'parent' });
    expect(down.status).toBe(200);
    expect((await owner.get('/api/members')).status).toBe(200);
    const newOwner = await signedIn(t, DEMO.parent);
    await newOwner.send('patch', `/api/members/${ownerRow.id}`, { role: 'owner' }).expect(200);
    await owner.send('patch', `/api/members/${parentRow.id}`, { role: 'parent' }).expect(200);
  });
});
