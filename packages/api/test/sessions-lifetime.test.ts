import { afterAll, beforeAll, describe, it } from 'vitest';
import { DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

let t: TestApp;

// An absolute lifetime of 3.6 s, however active the session is (room for slow requests on a
// busy machine before it ends).
beforeAll(async () => {
  t = await startTestApp({ SESSION_MAX_HOURS: '0.001' });
});
afterAll(() => t.close());

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('absolute lifetime', () => {
  it('ends a session after its maximum age even while it is in use', async () => {
    const client = await signedIn(t, DEMO.owner);
    const signedInAt = Date.now();
    for (let i = 0; i < 3; i += 1) {
      await pause(500);
      await client.get('/api/auth/me').expect(200);
    }
    // Active all along (each request rolls the idle limit on), yet out once 3.6 s have passed.
    await pause(Math.max(0, signedInAt + 3_800 - Date.now()));
    await client.get('/api/auth/me').expect(401);
  });
});
