import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { getStudents } from '../features/students/api/get-students';
import { CSRF, json, mockApi, ownerMe, students, tutorMe } from '../testing/mock-api';
import { getMe, signOut, type Me } from './auth';
import { keptMe, keptStudents } from './kept-me';

const offline = () =>
  vi.stubGlobal(
    'fetch',
    vi.fn(() => Promise.reject(new TypeError('Failed to fetch'))),
  );

beforeEach(() => localStorage.clear());
afterEach(() => vi.unstubAllGlobals());

describe('what the phone keeps for opening offline', () => {
  it('answers with the last person signed in, marked offline, when the server cannot be reached', async () => {
    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': json(200, { items: students, total: students.length }),
    });
    await expect(getMe()).resolves.toEqual(ownerMe);
    await getStudents();
    offline();
    await expect(getMe()).resolves.toEqual({ ...ownerMe, offline: true });
    // Of the children, only ids and names (the log form's choice): no grade, no dates.
    expect(keptStudents(10)).toEqual(students.map(({ id, name }) => ({ id, name })));
    expect(JSON.stringify(localStorage)).not.toMatch(/gradeLevel|createdAt/);
    expect(keptStudents(11)).toBeNull();
  });

  it('keeps no children’s names for a tutor, and drops them when the household changes', async () => {
    mockApi({
      'GET /auth/me': json(200, tutorMe),
      'GET /students': json(200, { items: students, total: 2 }),
    });
    await getMe();
    await getStudents();
    expect(keptStudents(10)).toBeNull();

    mockApi({
      'GET /auth/me': json(200, ownerMe),
      'GET /students': json(200, { items: students, total: 2 }),
    });
    await getMe();
    await getStudents();
    expect(keptStudents(10)).not.toBeNull();
    const elsewhere: Me = {
      ...ownerMe,
      household: { id: 12, name: 'Birch Room', role: 'owner' },
    } as Me;
    mockApi({ 'GET /auth/me': json(200, elsewhere) });
    await getMe();
    expect(keptStudents(10)).toBeNull();
    expect(keptStudents(12)).toBeNull();
  });

  it('forgets everything on sign-out, and when the server says nobody is signed in', async () => {
    mockApi({ ...CSRF, 'GET /auth/me': json(200, ownerMe), 'POST /auth/logout': json(204) });
    await getMe();
    expect(keptMe()).not.toBeNull();
    await signOut();
    expect(localStorage.length).toBe(0);
    offline();
    await expect(getMe()).rejects.toMatchObject({ status: 0 });

    mockApi({ 'GET /auth/me': json(200, ownerMe) });
    await getMe();
    mockApi({ 'GET /auth/me': json(401, { statusCode: 401, message: 'Sign in first' }) });
    await expect(getMe()).resolves.toBeNull();
    expect(keptMe()).toBeNull();
  });
});
