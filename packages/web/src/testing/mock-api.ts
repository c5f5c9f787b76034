import { vi } from 'vitest';

export type RecordedRequest = {
  method: string;
  path: string;
  headers: Record<string, string>;
  body: unknown;
};

type Reply = { status?: number; body?: unknown };
type Handler = Reply | ((request: RecordedRequest) => Reply);

/** `json(201, student)`: a reply for {@link mockApi}. */
export const json = (status: number, body?: unknown): Reply => ({ status, body });

/**
 * Replaces `fetch` with a tiny fake of the API: handlers keyed by `'METHOD /path'` (without the
 * `/api` prefix). Unknown requests answer 404 so a test notices them. Returns the recorded calls.
 */
export function mockApi(handlers: Record<string, Handler>) {
  const requests: RecordedRequest[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(String(input), 'http://localhost');
    const method = (init.method ?? 'GET').toUpperCase();
    const path = url.pathname.replace(/^\/api/, '') + url.search;
    const headers = Object.fromEntries(new Headers(init.headers).entries());
    const body = typeof init.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined;
    const request = { method, path, headers, body };
    requests.push(request);
    const handler = handlers[`${method} ${path}`];
    const reply =
      typeof handler === 'function'
        ? handler(request)
        : (handler ?? json(404, { statusCode: 404, error: 'Not Found', message: 'Not here' }));
    const status = reply.status ?? 200;
    return new Response(
      reply.body === undefined || status === 204 ? null : JSON.stringify(reply.body),
      { status, headers: { 'content-type': 'application/json' } },
    );
  });
  vi.stubGlobal('fetch', fetchMock);
  return { requests, fetchMock };
}

export const CSRF = { 'GET /auth/csrf': json(200, { token: 'csrf-1' }) };

export const ownerMe = {
  user: { id: 1, email: 'sam@example.test', displayName: 'Sam', isAdmin: false },
  household: { id: 10, name: 'Maple Table', role: 'owner' },
  households: [{ id: 10, name: 'Maple Table', role: 'owner' }],
};

export const tutorMe = {
  user: { id: 3, email: 'tutor@example.test', displayName: 'Robin', isAdmin: false },
  household: { id: 10, name: 'Maple Table', role: 'tutor' },
  households: [{ id: 10, name: 'Maple Table', role: 'tutor' }],
};

export const adminMe = {
  user: { id: 4, email: 'admin@example.test', displayName: 'Site Admin', isAdmin: true },
  household: null,
  households: [],
};

export const students = [
  {
    id: 1,
    name: 'Juniper',
    gradeLevel: '4',
    createdAt: '2026-09-01T10:00:00.000Z',
    updatedAt: '2026-09-01T10:00:00.000Z',
  },
  {
    id: 2,
    name: 'Ollie',
    gradeLevel: '2',
    createdAt: '2026-09-02T10:00:00.000Z',
    updatedAt: '2026-09-02T10:00:00.000Z',
  },
];
