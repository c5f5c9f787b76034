import { afterAll, beforeAll, expect, it } from 'vitest';
import { Client, startTestApp, type TestApp } from './support/test-app.js';

// Its own file: models are bound to one app's connection per process.
let t: TestApp;

beforeAll(async () => {
  t = await startTestApp({ SMTP_URL: '', SIGN_IN_LIMIT_PER_MINUTE: '2' });
});
afterAll(() => t.close());

it('throttles reset requests and confirmations like sign-in (429)', async () => {
  const c = new Client(t.http());
  await c.refreshToken();
  const asks: number[] = [];
  for (let i = 0; i < 3; i++) {
    asks.push((await c.post('/api/auth/password-reset', { email: 'x@example.test' })).status);
  }
  expect(asks).toEqual([202, 202, 429]);
  const confirms: number[] = [];
  for (let i = 0; i < 3; i++) {
    const res = await c.post('/api/auth/password-reset/confirm', {
      token: 'y'.repeat(43),
      password: 'long-enough-password',
    });
    confirms.push(res.status);
  }
  expect(confirms).toEqual([404, 404, 429]);
});
