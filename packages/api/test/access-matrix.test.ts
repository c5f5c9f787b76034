import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fixture } from './support/photos.js';
import { listApiRoutes } from './support/routes.js';
import {
  Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

type Actor = 'anon' | 'owner' | 'parent' | 'tutor' | 'tutorUngranted' | 'admin' | 'stranger';
const ACTORS: Actor[] = ['anon', 'owner', 'parent', 'tutor', 'tutorUngranted', 'admin', 'stranger'];
type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

interface Ids {
  /** A student the actor's request targets: the granted one, or the other for tutorUngranted. */
  student: number;
  /** A miss of that student, and a photo of that miss. */
  miss: number;
  photo: number;
  /** The household's course, lesson and answer key, and a sitting of the student on that key. */
  course: number;
  lesson: number;
  key: number;
  keyItem: number;
  sitting: number;
  /** A check-up of the student not yet taken, and as many answers as it has problems. */
  checkUp: number;
  checkUpAnswers?: string[];
  /** A review plan and a pattern note of the student (made fresh by the cases that need them). */
  plan?: number;
  patternNote?: number;
}

interface Case {
  route: string;
  path: (ids: Ids) => string;
  body?: object | ((ids: Ids) => object);
  /** Use a fresh session and fresh target for each actor (the call changes them). */
  destructive?: boolean;
  /** How a destructive case makes its fresh target (default: a new student). */
  fresh?: (student: number) => Promise<Partial<Ids>>;
  expect: Record<Actor, number>;
}

const same = (status: number): Record<Actor, number> =>
  Object.fromEntries(ACTORS.map((a) => [a, status])) as Record<Actor, number>;

const members = (ok: number, admin = 403): Record<Actor, number> => ({
  anon: 401,
  owner: ok,
  parent: ok,
  tutor: ok,
  tutorUngranted: ok,
  admin,
  stranger: ok,
});

// Every route × every kind of caller → the status DESIGN.md's roles imply.
const CASES: Case[] = [
  { route: 'GET /api/health', path: () => '/api/health', expect: same(200) },
  {
    route: 'GET /api/admin/metrics',
    path: () => '/api/admin/metrics',
    expect: { ...same(403), anon: 401, admin: 200 },
  },
  { route: 'GET /api/auth/csrf', path: () => '/api/auth/csrf', expect: same(200) },
  { route: 'GET /api/docs', path: () => '/api/docs', expect: same(200) },
  { route: 'POST /api/auth/login', path: () => '/api/auth/login', body: {}, expect: same(400) },
  {
    route: 'POST /api/auth/register',
    path: () => '/api/auth/register',
    body: {},
    expect: same(400),
  },
  {
    route: 'POST /api/auth/logout',
    path: () => '/api/auth/logout',
    destructive: true,
    expect: { ...members(204, 204) },
  },
  { route: 'GET /api/auth/me', path: () => '/api/auth/me', expect: members(200, 200) },
  {
    route: 'GET /api/households/current',
    path: () => '/api/households/current',
    expect: members(200),
  },
  // Members, invitations, mail, password reset, export (membership ids and household 1 are the demo's, seeded first).
  ...memberMailCases(),
  { route: 'GET /api/students', path: () => '/api/students', expect: members(200) },
  {
    route: 'POST /api/students',
    path: () => '/api/students',
    body: { name: 'Matrix', gradeLevel: '3' },
    expect: { ...members(201), tutor: 403, tutorUngranted: 403 },
  },
  {
    route: 'GET /api/students/:id',
    path: ({ student }) => `/api/students/${student}`,
    expect: { ...members(200), tutorUngranted: 404, stranger: 404 },
  },
  {
    route: 'PATCH /api/students/:id',
    path: ({ student }) => `/api/students/${student}`,
    body: { gradeLevel: '4' },
    expect: { ...members(200), tutor: 403, tutorUngranted: 403, stranger: 404 },
  },
  {
    route: 'DELETE /api/students/:id',
    path: ({ student }) => `/api/students/${student}`,
    destructive: true,
    expect: { ...members(204), tutor: 403, tutorUngranted: 403, stranger: 404 },
  },
  ...MISS_CASES(),
  ...KEY_CASES(),
  ...PLAN_CASES(),
];

function memberMailCases(): Case[] {
  const editors = (ok: number, stranger = ok): Record<Actor, number> => ({
    ...members(ok),
    tutor: 403,
    tutorUngranted: 403,
    stranger,
  });
  const ownerOnly = (ok: number): Record<Actor, number> => ({ ...editors(ok), parent: 403 });
  const token = 'a'.repeat(43);
  return [
    { route: 'GET /api/dev/outbox', path: () => '/api/dev/outbox', expect: same(200) },
    {
      route: 'POST /api/auth/password-reset',
      path: () => '/api/auth/password-reset',
      body: {},
      expect: same(400),
    },
    {
      route: 'POST /api/auth/password-reset/confirm',
      path: () => '/api/auth/password-reset/confirm',
      body: {},
      expect: same(400),
    },
    {
      // The demo's accounts are confirmed (409); the newly registered stranger is not yet (202).
      route: 'POST /api/auth/email-verification',
      path: () => '/api/auth/email-verification',
      expect: { ...members(409, 409), stranger: 202 },
    },
    {
      route: 'POST /api/auth/email-verification/confirm',
      path: () => '/api/auth/email-verification/confirm',
      body: {},
      expect: same(400),
    },
    {
      route: 'POST /api/households/current',
      path: () => '/api/households/current',
      body: { householdId: 1 },
      expect: { ...members(200, 404), stranger: 404 },
    },
    {
      route: 'DELETE /api/households/current',
      path: () => '/api/households/current',
      body: { confirm: 'not the name' },
      expect: ownerOnly(400),
    },
    { route: 'GET /api/export', path: () => '/api/export', expect: ownerOnly(200) },
    { route: 'GET /api/invitations', path: () => '/api/invitations', expect: editors(200) },
    {
      route: 'POST /api/invitations',
      path: () => '/api/invitations',
      body: { email: 'matrix@example.test', role: 'parent' },
      // The stranger's new account has not confirmed its address yet.
      expect: editors(201, 403),
    },
    {
      route: 'DELETE /api/invitations/:id',
      path: () => '/api/invitations/999999',
      expect: editors(404),
    },
    {
      route: 'GET /api/invitations/:token',
      path: () => `/api/invitations/${token}`,
      expect: same(404),
    },
    {
      route: 'POST /api/invitations/:token/accept',
      path: () => `/api/invitations/${token}/accept`,
      body: {},
      expect: same(404),
    },
    { route: 'GET /api/members', path: () => '/api/members', expect: editors(200) },
    { route: 'GET /api/members/:id', path: () => '/api/members/1', expect: editors(200, 404) },
    {
      route: 'PATCH /api/members/:id',
      path: () => '/api/members/1',
      body: { role: 'owner' },
      expect: { ...ownerOnly(200), stranger: 404 },
    },
    {
      route: 'DELETE /api/members/:id',
      path: () => '/api/members/1',
      expect: { ...ownerOnly(409), stranger: 404 },
    },
  ];
}

let t: TestApp;
let clients: Record<Actor, Client>;
let granted: number;
let ungranted: number;
let targets: Record<number, { miss: number; photo: number }>;
let keyTargets: Awaited<ReturnType<typeof freshKeyTargets>>;

async function clientFor(actor: Actor): Promise<Client> {
  switch (actor) {
    case 'anon': {
      const c = new Client(t.http());
      await c.refreshToken();
      return c;
    }
    case 'owner':
      return signedIn(t, DEMO.owner);
    case 'parent':
      return signedIn(t, DEMO.parent);
    case 'tutor':
    case 'tutorUngranted':
      return signedIn(t, DEMO.tutor);
    case 'admin':
      return signedIn(t, DEMO.admin);
    case 'stranger':
      return signedIn(t, 'stranger@example.test', 'a-long-enough-password');
  }
}

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  await registered(t, 'stranger@example.test', 'Another household');
  const entries = await Promise.all(ACTORS.map(async (a) => [a, await clientFor(a)] as const));
  clients = Object.fromEntries(entries) as Record<Actor, Client>;
  const list = await clients.owner.get('/api/students').expect(200);
  const byName = new Map<string, number>(
    (list.body.items as { id: number; name: string }[]).map((s) => [s.name, s.id]),
  );
  granted = byName.get('Wren')!;
  ungranted = byName.get('Milo')!;
  targets = {};
  for (const student of [granted, ungranted]) targets[student] = await freshMiss(student);
  keyTargets = await freshKeyTargets();
});
afterAll(() => t.close());

describe('household scoping', () => {
  it('shows the owner both demo children and the tutor only the granted one', async () => {
    const owner = await clients.owner.get('/api/students').expect(200);
    expect(owner.body.total).toBe(2);
    const tutor = await clients.tutor.get('/api/students').expect(200);
    expect(tutor.body.items.map((s: { name: string }) => s.name)).toEqual(['Wren']);
  });

  it('shows a new household no students and 404 for the demo ones', async () => {
    const stranger = await clients.stranger.get('/api/students').expect(200);
    expect(stranger.body.items.some((s: { name: string }) => s.name === 'Wren')).toBe(false);
    await clients.stranger.get(`/api/students/${granted}`).expect(404);
    await clients.stranger.get(`/api/students/${ungranted}`).expect(404);
  });
});

describe('tutor aggregates', () => {
  it('counts and lists only the granted child’s sittings in a key’s totals and corrections', async () => {
    const owner = clients.owner;
    const key = (
      await owner
        .post('/api/answer-keys', {
          title: 'Aggregate key',
          kind: 'review',
          items: [{ number: 1, prompt: '47 x 24', answer: '1,138' }],
        })
        .expect(201)
    ).body;
    const item = key.items[0].id as number;
    const sittingOf: Record<number, number> = {};
    for (const student of [granted, ungranted]) {
      const s = await owner
        .post('/api/sittings', {
          studentId: student,
          answerKeyId: key.id,
          startedAt: '2026-01-07T09:00',
        })
        .expect(201);
      sittingOf[student] = s.body.id;
      await owner
        .send('put', `/api/sittings/${s.body.id}/marks`, {
          marks: [{ keyItemId: item, correct: false, answer: '1,128' }],
        })
        .expect(200);
    }
    await owner
      .send('patch', `/api/answer-keys/${key.id}`, {
        reason: 'The printed key had a typo',
        items: [{ id: item, number: 1, prompt: '47 x 24', answer: '1,128' }],
      })
      .expect(200);

    const countIn = async (c: Client) =>
      (
        (await c.get('/api/answer-keys').expect(200)).body.items as {
          id: number;
          sittingCount: number;
        }[]
      ).find((k) => k.id === key.id)!.sittingCount;
    const remarkedIn = async (c: Client) =>
      (await c.get(`/api/answer-keys/${key.id}`).expect(200)).body.corrections[0]
        .remarkedSittingIds;

    expect(await countIn(owner)).toBe(2);
    expect(await countIn(clients.tutor)).toBe(1);
    expect(
      (await clients.tutor.get(`/api/answer-keys/${key.id}`).expect(200)).body.sittingCount,
    ).toBe(1);
    expect(await remarkedIn(owner)).toEqual(
      [sittingOf[granted], sittingOf[ungranted]].sort((a, b) => a! - b!),
    );
    expect(await remarkedIn(clients.tutor)).toEqual([sittingOf[granted]]);
  });
});

describe('odd ids', () => {
  it.each(['0x13', '1e1', '19.0', '+19', '0', '-1'])(
    'answers 400 naming id for %j in a path',
    async (odd) => {
      const res = await clients.owner.get(`/api/students/${encodeURIComponent(odd)}`);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.fields)).toEqual(['id']);
    },
  );

  it.each(['0x13', '1e1', '19.0'])(
    'answers 400 naming studentId for %j in a query',
    async (odd) => {
      const res = await clients.owner.get(`/api/misses?studentId=${encodeURIComponent(odd)}`);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.fields)).toEqual(['studentId']);
    },
  );
});

describe('access matrix', () => {
  it('covers every route the app serves', () => {
    const served = listApiRoutes(t.app).filter((r) => !r.startsWith('GET /api/docs'));
    const covered = CASES.map((c) => c.route).filter((r) => r !== 'GET /api/docs');
    expect(served).toEqual([...covered].sort());
  });

  const cells = CASES.flatMap((c) => ACTORS.map((actor) => ({ c, actor })));
  it.each(cells.map(({ c, actor }) => [c.route, actor, c.expect[actor], c, actor] as const))(
    '%s as %s → %i',
    async (_route, _actorName, status, c, actor) => {
      const client = c.destructive ? await clientFor(actor) : clients[actor];
      let student = actor === 'tutorUngranted' ? ungranted : granted;
      const ids: Ids = {
        student,
        ...targets[student]!,
        ...keyTargets,
        sitting: keyTargets.sittings[student]!,
        checkUp: keyTargets.checkUps[student]!,
      };
      if (c.destructive && c.fresh) {
        Object.assign(ids, await c.fresh(student));
      } else if (c.destructive && c.route.includes(':id')) {
        const fresh = await clients.owner.post('/api/students', { name: 'Temp', gradeLevel: '2' });
        student = fresh.body.id as number;
        ids.student = student;
      }
      const method = c.route.split(' ')[0]!;
      const body = typeof c.body === 'function' ? c.body(ids) : c.body;
      const res = await client.send(method.toLowerCase() as Method, c.path(ids), body);
      expect(res.status, `${c.route} as ${actor}: ${(res.text ?? '').slice(0, 200)}`).toBe(status);
    },
  );
});

/** A miss with one photo for a student, made by the owner. */
async function freshMiss(student: number): Promise<{ miss: number; photo: number }> {
  const owner = clients.owner;
  const res = await owner.agent
    .post('/api/misses')
    .set('x-csrf-token', owner.token)
    .field('studentId', String(student))
    .field('occurredOn', '2026-01-05')
    .field('problem', '304 - 75')
    .field('answer', '139')
    .attach('photos', fixture('sheet.png'), { filename: 'a.png', contentType: 'image/png' });
  if (res.status !== 201) throw new Error(`fresh miss: ${res.status} ${res.text}`);
  return { miss: res.body.id as number, photo: res.body.photos[0].id as number };
}

function MISS_CASES(): Case[] {
  const scoped = (ok: number) => ({ ...members(ok), tutorUngranted: 404, stranger: 404 });
  const editors = (ok: number) => ({ ...scoped(ok), tutor: 403, tutorUngranted: 403 });
  return [
    { route: 'GET /api/misses', path: () => '/api/misses', expect: members(200) },
    {
      route: 'POST /api/misses',
      path: () => '/api/misses',
      body: ({ student }) => ({
        studentId: student,
        occurredOn: '2026-01-05',
        problem: '81 - 38',
        answer: '57',
      }),
      expect: editors(201),
    },
    {
      route: 'GET /api/misses/:id',
      path: ({ miss }) => `/api/misses/${miss}`,
      expect: scoped(200),
    },
    {
      route: 'PATCH /api/misses/:id',
      path: ({ miss }) => `/api/misses/${miss}`,
      body: { status: 'discussed' },
      expect: editors(200),
    },
    {
      route: 'DELETE /api/misses/:id',
      path: ({ miss }) => `/api/misses/${miss}`,
      destructive: true,
      fresh: freshMiss,
      expect: editors(204),
    },
    {
      // A JSON request carries no files: the owner gets the "attach photos" refusal.
      route: 'POST /api/misses/:id/photos',
      path: ({ miss }) => `/api/misses/${miss}/photos`,
      expect: editors(400),
    },
    {
      route: 'GET /api/photos/:id/image',
      path: ({ photo }) => `/api/photos/${photo}/image`,
      expect: scoped(200),
    },
    {
      route: 'GET /api/photos/:id/thumb',
      path: ({ photo }) => `/api/photos/${photo}/thumb`,
      expect: scoped(200),
    },
    {
      route: 'GET /api/photos/:id/small',
      path: ({ photo }) => `/api/photos/${photo}/small`,
      expect: scoped(200),
    },
    {
      route: 'PUT /api/photos/:id/marks',
      path: ({ photo }) => `/api/photos/${photo}/marks`,
      body: { marks: [{ x: 0.5, y: 0.5, label: 'here' }] },
      expect: scoped(200),
    },
    {
      route: 'DELETE /api/photos/:id',
      path: ({ photo }) => `/api/photos/${photo}`,
      destructive: true,
      fresh: freshMiss,
      expect: editors(204),
    },
    { route: 'GET /api/notes', path: () => '/api/notes', expect: members(200) },
    {
      route: 'POST /api/notes',
      path: () => '/api/notes',
      body: ({ miss }) => ({ missId: miss, body: 'Looked at this together.' }),
      expect: scoped(201),
    },
    {
      route: 'POST /api/diagnose',
      path: () => '/api/diagnose',
      body: { problem: '81 - 38', answer: '57' },
      expect: members(200),
    },
  ];
}

/** A course with a lesson, a key on it, and a sitting of each demo child, made by the owner. */
async function freshKeyTargets() {
  const owner = clients.owner;
  const course = (await owner.post('/api/courses', { name: 'Matrix course' }).expect(201)).body;
  const lesson = (
    await owner.post(`/api/courses/${course.id}/lessons`, { number: 1, title: 'One' }).expect(201)
  ).body;
  const key = (
    await owner
      .post('/api/answer-keys', {
        title: 'Matrix key',
        kind: 'review',
        courseId: course.id,
        items: [{ number: 1, prompt: '81 - 38', answer: '43', revisit: ['1'] }],
      })
      .expect(201)
  ).body;
  const sittings: Record<number, number> = {};
  for (const student of [granted, ungranted]) {
    const s = await owner
      .post('/api/sittings', {
        studentId: student,
        answerKeyId: key.id,
        startedAt: '2026-01-05T09:00',
      })
      .expect(201);
    sittings[student] = s.body.id as number;
  }
  const checkUps: Record<number, number> = {};
  for (const student of [granted, ungranted])
    checkUps[student] = (await freshCheckUp(student)).checkUp!;
  return {
    checkUps,
    course: course.id as number,
    lesson: lesson.id as number,
    key: key.id as number,
    keyItem: key.items[0].id as number,
    sittings,
  };
}

/** A check-up of the student, made by the owner, with a right answer for each of its problems. */
async function freshCheckUp(student: number): Promise<Partial<Ids>> {
  const res = await clients.owner
    .post('/api/check-ups', { studentId: student, ruleIds: ['sub.smaller-from-larger'] })
    .expect(201);
  const problems = res.body.problems as { answers: { correct: string } }[];
  return { checkUp: res.body.id as number, checkUpAnswers: problems.map((p) => p.answers.correct) };
}

let lessonNumber = 100;

/** A review plan of one fresh miss of the student, and a note on one of their patterns, made by the owner. */
async function freshPlan(student: number): Promise<Partial<Ids>> {
  const { miss } = await freshMiss(student);
  const plan = await clients.owner
    .post('/api/review-plans', { studentId: student, scheduledFor: '2026-01-09', missIds: [miss] })
    .expect(201);
  const note = await clients.owner
    .post('/api/patterns/notes', { studentId: student, patternKey: 'fact:x7', body: 'Matrix.' })
    .expect(201);
  return { plan: plan.body.id as number, patternNote: note.body.id as number };
}

function PLAN_CASES(): Case[] {
  const scoped = (ok: number) => ({ ...members(ok), tutorUngranted: 404, stranger: 404 });
  const editors = (ok: number) => ({ ...scoped(ok), tutor: 403, tutorUngranted: 403 });
  const onPlan = { destructive: true, fresh: freshPlan };
  return [
    {
      route: 'GET /api/patterns',
      path: ({ student }) => `/api/patterns?studentId=${student}`,
      expect: scoped(200),
    },
    {
      route: 'GET /api/patterns/notes',
      path: ({ student }) => `/api/patterns/notes?studentId=${student}`,
      expect: scoped(200),
    },
    {
      route: 'POST /api/patterns/notes',
      path: () => '/api/patterns/notes',
      body: ({ student }) => ({ studentId: student, patternKey: 'fact:x7', body: 'Sevens.' }),
      expect: scoped(201),
    },
    {
      route: 'DELETE /api/patterns/notes/:id',
      path: ({ patternNote }) => `/api/patterns/notes/${patternNote}`,
      ...onPlan,
      expect: editors(204),
    },
    { route: 'GET /api/review-plans', path: () => '/api/review-plans', expect: members(200) },
    {
      route: 'POST /api/review-plans',
      path: () => '/api/review-plans',
      body: ({ student, miss }) => ({
        studentId: student,
        scheduledFor: '2026-01-09',
        missIds: [miss],
      }),
      expect: scoped(201),
    },
    {
      route: 'GET /api/review-plans/:id',
      path: ({ plan }) => `/api/review-plans/${plan}`,
      ...onPlan,
      expect: scoped(200),
    },
    {
      route: 'PATCH /api/review-plans/:id',
      path: ({ plan }) => `/api/review-plans/${plan}`,
      body: { scheduledFor: '2026-01-10' },
      ...onPlan,
      expect: scoped(200),
    },
    {
      route: 'GET /api/review-plans/:id/export.pdf',
      path: ({ plan }) => `/api/review-plans/${plan}/export.pdf`,
      ...onPlan,
      expect: scoped(200),
    },
    {
      route: 'GET /api/review-plans/:id/export.csv',
      path: ({ plan }) => `/api/review-plans/${plan}/export.csv`,
      ...onPlan,
      expect: scoped(200),
    },
    {
      // Membership 1 is the demo owner's.
      route: 'POST /api/review-plans/:id/send',
      path: ({ plan }) => `/api/review-plans/${plan}/send`,
      body: { memberIds: [1] },
      ...onPlan,
      expect: editors(200),
    },
    {
      route: 'GET /api/students/:id/portfolio.pdf',
      path: ({ student }) => `/api/students/${student}/portfolio.pdf?from=2026-01-01&to=2026-01-31`,
      expect: scoped(200),
    },
  ];
}

function KEY_CASES(): Case[] {
  // Courses and keys belong to the household (a tutor reads them all); sittings follow grants.
  const household = (ok: number) => ({ ...members(ok), stranger: 404 });
  const householdEdit = (ok: number) => ({ ...household(ok), tutor: 403, tutorUngranted: 403 });
  const create = (ok: number) => ({ ...members(ok), tutor: 403, tutorUngranted: 403 });
  const scoped = (ok: number) => ({ ...members(ok), tutorUngranted: 404, stranger: 404 });
  const editors = (ok: number) => ({ ...scoped(ok), tutor: 403, tutorUngranted: 403 });
  const emptyCourse = async () => ({
    course: (await clients.owner.post('/api/courses', { name: 'Temp course' })).body.id as number,
  });
  return [
    { route: 'GET /api/courses', path: () => '/api/courses', expect: members(200) },
    {
      route: 'POST /api/courses',
      path: () => '/api/courses',
      body: { name: 'Matrix' },
      expect: create(201),
    },
    {
      route: 'GET /api/courses/:id',
      path: ({ course }) => `/api/courses/${course}`,
      expect: household(200),
    },
    {
      route: 'PATCH /api/courses/:id',
      path: ({ course }) => `/api/courses/${course}`,
      body: { level: 'Level 2' },
      expect: householdEdit(200),
    },
    {
      route: 'DELETE /api/courses/:id',
      path: ({ course }) => `/api/courses/${course}`,
      destructive: true,
      fresh: emptyCourse,
      expect: householdEdit(204),
    },
    {
      route: 'GET /api/courses/:id/lessons',
      path: ({ course }) => `/api/courses/${course}/lessons`,
      expect: household(200),
    },
    {
      route: 'POST /api/courses/:id/lessons',
      path: ({ course }) => `/api/courses/${course}/lessons`,
      body: () => ({ number: lessonNumber++, title: 'Matrix lesson' }),
      expect: householdEdit(201),
    },
    {
      route: 'PATCH /api/lessons/:id',
      path: ({ lesson }) => `/api/lessons/${lesson}`,
      body: { title: 'Renamed' },
      expect: householdEdit(200),
    },
    {
      route: 'DELETE /api/lessons/:id',
      path: ({ lesson }) => `/api/lessons/${lesson}`,
      destructive: true,
      fresh: async () => {
        const { course } = await emptyCourse();
        const res = await clients.owner.post(`/api/courses/${course}/lessons`, {
          number: 1,
          title: 'Temp',
        });
        return { lesson: res.body.id as number };
      },
      expect: householdEdit(204),
    },
    { route: 'GET /api/answer-keys', path: () => '/api/answer-keys', expect: members(200) },
    {
      route: 'POST /api/answer-keys',
      path: () => '/api/answer-keys',
      body: { title: 'Matrix', kind: 'worksheet', items: [] },
      expect: create(201),
    },
    {
      // A JSON request is not an upload: those who may import get 415.
      route: 'POST /api/answer-keys/import',
      path: () => '/api/answer-keys/import',
      body: { title: 'Matrix', kind: 'worksheet' },
      expect: create(415),
    },
    {
      route: 'GET /api/answer-keys/:id',
      path: ({ key }) => `/api/answer-keys/${key}`,
      expect: household(200),
    },
    {
      route: 'GET /api/answer-keys/:id/export.csv',
      path: ({ key }) => `/api/answer-keys/${key}/export.csv`,
      expect: household(200),
    },
    {
      route: 'PATCH /api/answer-keys/:id',
      path: ({ key }) => `/api/answer-keys/${key}`,
      body: { title: 'Matrix key' },
      expect: householdEdit(200),
    },
    {
      route: 'DELETE /api/answer-keys/:id',
      path: ({ key }) => `/api/answer-keys/${key}`,
      destructive: true,
      fresh: async () => {
        const res = await clients.owner.post('/api/answer-keys', {
          title: 'Temp key',
          kind: 'review',
          items: [],
        });
        return { key: res.body.id as number };
      },
      expect: householdEdit(204),
    },
    { route: 'GET /api/sittings', path: () => '/api/sittings', expect: members(200) },
    {
      route: 'POST /api/sittings',
      path: () => '/api/sittings',
      body: ({ student, key }) => ({
        studentId: student,
        answerKeyId: key,
        startedAt: '2026-01-06T15:00',
      }),
      expect: editors(201),
    },
    {
      route: 'GET /api/sittings/:id',
      path: ({ sitting }) => `/api/sittings/${sitting}`,
      expect: scoped(200),
    },
    {
      route: 'PUT /api/sittings/:id/marks',
      path: ({ sitting }) => `/api/sittings/${sitting}/marks`,
      body: ({ keyItem }) => ({ marks: [{ keyItemId: keyItem, correct: true }] }),
      expect: editors(200),
    },
    { route: 'GET /api/check-ups', path: () => '/api/check-ups', expect: members(200) },
    {
      route: 'POST /api/check-ups',
      path: () => '/api/check-ups',
      body: ({ student }) => ({ studentId: student, ruleIds: ['sub.smaller-from-larger'] }),
      expect: scoped(201),
    },
    {
      route: 'GET /api/check-ups/:id',
      path: ({ checkUp }) => `/api/check-ups/${checkUp}`,
      expect: scoped(200),
    },
    {
      route: 'GET /api/check-ups/:id/sheet.pdf',
      path: ({ checkUp }) => `/api/check-ups/${checkUp}/sheet.pdf`,
      expect: scoped(200),
    },
    {
      route: 'GET /api/check-ups/:id/answers.pdf',
      path: ({ checkUp }) => `/api/check-ups/${checkUp}/answers.pdf`,
      expect: scoped(200),
    },
    {
      route: 'POST /api/check-ups/:id/answers',
      path: ({ checkUp }) => `/api/check-ups/${checkUp}/answers`,
      body: ({ checkUpAnswers }) => ({ startedAt: '2026-01-07T10:00', answers: checkUpAnswers }),
      destructive: true,
      fresh: freshCheckUp,
      expect: editors(201),
    },
    {
      route: 'GET /api/students/:id/sittings/summary',
      path: ({ student }) => `/api/students/${student}/sittings/summary`,
      expect: scoped(200),
    },
  ];
}
