import { describe, expect, it } from 'vitest';

import { CSRF, json, mockApi } from '../testing/mock-api';
import { api, ApiError, forgetCsrfToken } from './api-client';

describe('api client', () => {
  it('reads with the session cookie and no CSRF token', async () => {
    const { requests, fetchMock } = mockApi({
      'GET /students': json(200, { items: [], total: 0 }),
    });
    await expect(api.get('/students')).resolves.toEqual({ items: [], total: 0 });
    expect(requests.map((r) => r.path)).toEqual(['/students']);
    expect(requests[0]?.headers['x-csrf-token']).toBeUndefined();
    expect(fetchMock.mock.calls[0]?.[1]?.credentials).toBe('same-origin');
    expect(String(fetchMock.mock.calls[0]?.[0])).toBe('/api/students');
  });

  it('fetches the CSRF token once and sends it on every write', async () => {
    const { requests } = mockApi({
      ...CSRF,
      'POST /students': json(201, { id: 7 }),
      'DELETE /students/7': json(204),
    });
    await api.post('/students', { name: 'Ada', gradeLevel: '3' });
    await expect(api.delete('/students/7')).resolves.toBeUndefined();
    expect(requests.map((r) => `${r.method} ${r.path}`)).toEqual([
      'GET /auth/csrf',
      'POST /students',
      'DELETE /students/7',
    ]);
    expect(requests[1]?.headers['x-csrf-token']).toBe('csrf-1');
    expect(requests[1]?.headers['content-type']).toBe('application/json');
    expect(requests[1]?.body).toEqual({ name: 'Ada', gradeLevel: '3' });
    expect(requests[2]?.headers['x-csrf-token']).toBe('csrf-1');
  });

  it('fetches a fresh token after the session changed', async () => {
    let issued = 0;
    const { requests } = mockApi({
      'GET /auth/csrf': () => json(200, { token: `csrf-${++issued}` }),
      'POST /auth/logout': json(204),
    });
    await api.post('/auth/logout');
    forgetCsrfToken();
    await api.post('/auth/logout');
    const sent = requests.filter((r) => r.method === 'POST').map((r) => r.headers['x-csrf-token']);
    expect(sent).toEqual(['csrf-1', 'csrf-2']);
  });

  it('retries once with a new token when the API rejects the token', async () => {
    let issued = 0;
    let attempts = 0;
    const { requests } = mockApi({
      'GET /auth/csrf': () => json(200, { token: `csrf-${++issued}` }),
      'PATCH /students/1': (request) => {
        attempts += 1;
        return request.headers['x-csrf-token'] === 'csrf-2'
          ? json(200, { id: 1 })
          : json(403, { statusCode: 403, error: 'Forbidden', message: 'Invalid CSRF token' });
      },
    });
    await expect(api.patch('/students/1', { name: 'B' })).resolves.toEqual({ id: 1 });
    expect(attempts).toBe(2);
    expect(requests.filter((r) => r.path === '/auth/csrf')).toHaveLength(2);
  });

  it('does not retry a 403 that is about the role', async () => {
    let attempts = 0;
    mockApi({
      ...CSRF,
      'POST /students': () => {
        attempts += 1;
        return json(403, { statusCode: 403, error: 'Forbidden', message: 'Tutors cannot do this' });
      },
    });
    await expect(api.post('/students', {})).rejects.toMatchObject({ status: 403 });
    expect(attempts).toBe(1);
  });

  it('turns a 400 into an ApiError naming the bad fields', async () => {
    mockApi({
      ...CSRF,
      'POST /students': json(400, {
        statusCode: 400,
        error: 'Bad Request',
        message: 'gradeLevel must be one of K, 1–8',
        fields: { gradeLevel: 'must be one of K, 1–8' },
      }),
    });
    const error = await api.post('/students', { name: 'A', gradeLevel: '12' }).catch((e) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 400,
      message: 'gradeLevel must be one of K, 1–8',
      fields: { gradeLevel: 'must be one of K, 1–8' },
    });
  });

  it('says to wait on 429', async () => {
    mockApi({
      ...CSRF,
      'POST /auth/login': json(429, { statusCode: 429, message: 'ThrottlerException' }),
    });
    await expect(api.post('/auth/login', {})).rejects.toMatchObject({
      status: 429,
      message: expect.stringMatching(/too many tries — wait a minute/i),
    });
  });

  it('keeps the sentence of a 429 that says which limit was met', async () => {
    const sentence =
      'This household has sent 10 invitations in the last hour: please wait a while before sending more';
    mockApi({
      ...CSRF,
      'POST /invitations': json(429, { statusCode: 429, message: sentence }),
    });
    await expect(api.post('/invitations', {})).rejects.toMatchObject({
      status: 429,
      message: sentence,
    });
  });

  it('copes with an error body that is not JSON, and with no network', async () => {
    const { fetchMock } = mockApi({});
    fetchMock.mockResolvedValueOnce(new Response('<html>oops</html>', { status: 502 }));
    await expect(api.get('/health')).rejects.toMatchObject({ status: 502 });

    fetchMock.mockRejectedValueOnce(new TypeError('Failed to fetch'));
    await expect(api.get('/health')).rejects.toMatchObject({
      status: 0,
      message: expect.stringMatching(/could not be reached/i),
    });
  });
});
