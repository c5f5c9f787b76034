import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

let t: TestApp;

// 0.05 minutes = 3 s of idle time (the cookie's Expires has whole-second precision).
beforeAll(async () => {
  t = await startTestApp({ SESSION_IDLE_MINUTES: '0.05' });
});
afterAll(() => t.close());

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('idle expiry', () => {
  it('keeps an active session alive and ends an idle one on the server', async () => {
    const client = await signedIn(t, DEMO.owner);
    let cookie = '';
    for (let i = 0; i < 3; i += 1) {
      await pause(1500);
      const res = await client.get('/api/auth/me').expect(200);
      const set = (res.headers['set-cookie'] as unknown as string[] | undefined) ?? [];
      cookie = set.find((c) => c.startsWith('workback.sid='))?.split(';')[0] ?? cookie;
    }
    expect(cookie).not.toBe('');
    await pause(4000);
    // Replayed by hand, so the 401 comes from the server's store, not the client's jar.
    const replay = await t.http().get('/api/auth/me').set('Cookie', cookie);
    expect(replay.status).toBe(401);
  });
});
