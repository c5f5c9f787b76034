import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listApiRoutes } from './support/routes.js';
import { type Client, DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

// Issue 13 §5: NUL and other control characters in a URL path segment (an id, an invitation
// token) answer 400 naming the parameter, on every route that has one, never a 5xx.
let t: TestApp;
let owner: Client;

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
});
afterAll(() => t.close());

describe('control characters in a path segment', () => {
  it('answer 400 naming the parameter on every route with one', async () => {
    const routes = listApiRoutes(t.app).filter((r) => r.includes('/:'));
    expect(routes.length).toBeGreaterThan(20);
    for (const route of routes) {
      const [method, url] = route.split(' ') as [string, string];
      const params = [...url.matchAll(/:(\w+)/g)].map((m) => m[1] as string);
      for (const name of params)
        for (const bad of ['a%00b', '%07', '1%0A']) {
          const path = url.replace(/:(\w+)/g, (_, p: string) => (p === name ? bad : '1'));
          const verb = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
          const res = verb === 'get' ? await owner.get(path) : await owner.send(verb, path, {});
          expect(
            res.status,
            `${route} with ${name}=${bad}: ${(res.text ?? '').slice(0, 160)}`,
          ).toBe(400);
          const body = (res.body?.fields ? res.body : JSON.parse(res.text)) as {
            fields?: Record<string, string>;
          };
          expect(Object.keys(body.fields ?? {}), `${route} ${name}`).toContain(name);
        }
    }
  }, 300_000);
});
