import { afterAll, beforeAll, describe, it } from 'vitest';
import { DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

let t: TestApp;

// An absolute lifetime of 1.8 s, however active the session is.
beforeAll(async () => {
  t = await startTestApp({ SESSION_MAX_HOURS: '0.0005' });
});
afterAll(() => t.close());

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('absolute lifetime', () => {
  it('ends a session after its maximum age even while it is in use', async () => {
    const client = await signedIn(t, DEMO.owner);
    for (let i = 0; i < 3; i += 1) {
      await pause(500);
      await client.get('/api/auth/me').expect(200);
    }
    await pause(500);
    await client.get('/api/auth/me').expect(401);
  });
});
