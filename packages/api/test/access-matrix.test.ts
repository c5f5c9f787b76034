import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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
}

interface Case {
  route: string;
  path: (ids: Ids) => string;
  body?: object;
  /** Use a fresh session and fresh target for each actor (the call changes them). */
  destructive?: boolean;
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
];

let t: TestApp;
let clients: Record<Actor, Client>;
let granted: number;
let ungranted: number;

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
      if (c.destructive && c.route.includes(':id')) {
        const fresh = await clients.owner.post('/api/students', { name: 'Temp', gradeLevel: '2' });
        student = fresh.body.id as number;
      }
      const method = c.route.split(' ')[0]!;
      const res = await client.send(method.toLowerCase() as Method, c.path({ student }), c.body);
      expect(res.status, `${c.route} as ${actor}: ${res.text.slice(0, 200)}`).toBe(status);
    },
  );
});
