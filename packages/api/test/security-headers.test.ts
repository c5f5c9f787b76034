import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO, signedIn, startTestApp } from './support/test-app.js';

const webDist = mkdtempSync(path.join(tmpdir(), 'workback-web-'));
writeFileSync(path.join(webDist, 'index.html'), '<!doctype html><title>Workback</title>');
afterAll(() => rmSync(webDist, { recursive: true, force: true }));

const STRICT_CSP = {
  'default-src': "'self'",
  'script-src': "'self'",
  'script-src-attr': "'none'",
  'style-src': "'self'",
  'img-src': "'self' data: blob:",
  'font-src': "'self'",
  'connect-src': "'self'",
  'object-src': "'none'",
  'base-uri': "'none'",
  'form-action': "'self'",
  'frame-ancestors': "'none'",
  'upgrade-insecure-requests': '',
};

function csp(header: unknown): Record<string, string> {
  return Object.fromEntries(
    String(header)
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .map(([name, ...values]) => [name!, values.join(' ')]),
  );
}

function pick(headers: Record<string, unknown>, names: string[]) {
  return Object.fromEntries(
    names.map((n) => [n, n === 'content-security-policy' ? csp(headers[n]) : headers[n]]),
  );
}

const SECURITY = [
  'content-security-policy',
  'x-content-type-options',
  'referrer-policy',
  'x-frame-options',
  'cross-origin-opener-policy',
  'strict-transport-security',
  'x-powered-by',
];

describe('security headers', () => {
  it('serves the web app and API JSON with a strict CSP, nosniff and no caching of personal data', async () => {
    const t = await startTestApp({ WEB_DIST: webDist });
    try {
      const page = await t.http().get('/students').set('Accept', 'text/html').expect(200);
      expect(page.text).toContain('<title>Workback</title>');
      expect(pick(page.headers, SECURITY)).toEqual({
        'content-security-policy': STRICT_CSP,
        'x-content-type-options': 'nosniff',
        'referrer-policy': 'no-referrer',
        'x-frame-options': 'DENY',
        'cross-origin-opener-policy': 'same-origin',
        'strict-transport-security': undefined,
        'x-powered-by': undefined,
      });

      const owner = await signedIn(t, DEMO.owner);
      const api = await owner.get('/api/students').expect(200);
      expect(api.headers['content-type']).toMatch(/^application\/json/);
      expect(api.headers['cache-control']).toBe('no-store');
      expect(csp(api.headers['content-security-policy'])).toEqual(STRICT_CSP);
      expect(api.headers['x-content-type-options']).toBe('nosniff');
      expect(api.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);

      // Only the OpenAPI UI is allowed its inline styles.
      const docs = await t.http().get('/api/docs').expect(200);
      expect(csp(docs.headers['content-security-policy'])).toEqual({
        ...STRICT_CSP,
        'style-src': "'self' 'unsafe-inline'",
      });
    } finally {
      await t.close();
    }
  });

  it('adds HSTS and Secure cookies in production behind a TLS proxy', async () => {
    const t = await startTestApp({
      NODE_ENV: 'production',
      TRUST_PROXY: 'true',
      LOG_LEVEL: 'silent',
      WEB_DIST: webDist,
    });
    try {
      const res = await t
        .http()
        .get('/api/auth/csrf')
        .set('X-Forwarded-Proto', 'https')
        .expect(200);
      expect(res.headers['strict-transport-security']).toBe('max-age=31536000; includeSubDomains');
      const cookie = (res.headers['set-cookie'] as unknown as string[])[0]!;
      expect(cookie).toMatch(/; Secure/);
      expect(cookie).toMatch(/; HttpOnly/);
      expect(cookie).toMatch(/; SameSite=Lax/);
    } finally {
      await t.close();
    }
  });
});
