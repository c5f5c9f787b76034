import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { DEMO, signedIn, startTestApp } from './support/test-app.js';

const webDist = mkdtempSync(path.join(tmpdir(), 'workback-web-'));
writeFileSync(path.join(webDist, 'index.html'), '<!doctype html><title>Workback</title>');
afterAll(() => rmSync(webDist, { recursive: true, force: true }));

/** The policy for every request over plain http (a home-network name or address). */
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
};
/** Over https the browser is also told to fetch nothing over plain http. */
const HTTPS_CSP = { ...STRICT_CSP, 'upgrade-insecure-requests': '' };

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

// startTestApp writes its settings into process.env; keep one test's from reaching the next.
afterEach(() => {
  for (const name of ['NODE_ENV', 'TRUST_PROXY', 'PUBLIC_URL', 'LOG_LEVEL'])
    delete process.env[name];
});

describe('security headers', () => {
  it('serves the web app and API JSON with a strict CSP, nosniff and no caching of personal data', async () => {
    const t = await startTestApp({ WEB_DIST: webDist });
    try {
      const page = await t.http().get('/students').set('Accept', 'text/html').expect(200);
      expect(page.text).toContain('<title>Workback</title>');
      // Plain http, as from a phone on the home Wi-Fi: no https-only headers, which would leave
      // the page blank (upgrade-insecure-requests) or draw console errors (the opener policy).
      expect(pick(page.headers, SECURITY)).toEqual({
        'content-security-policy': STRICT_CSP,
        'x-content-type-options': 'nosniff',
        'referrer-policy': 'no-referrer',
        'x-frame-options': 'DENY',
        'cross-origin-opener-policy': undefined,
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
      PUBLIC_URL: 'https://workback.example',
      // Production wants a relay; nothing here sends mail.
      SMTP_URL: 'smtp://127.0.0.1:9',
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

      const page = await t
        .http()
        .get('/students')
        .set('Accept', 'text/html')
        .set('X-Forwarded-Proto', 'https')
        .expect(200);
      expect(pick(page.headers, SECURITY)).toEqual({
        'content-security-policy': HTTPS_CSP,
        'x-content-type-options': 'nosniff',
        'referrer-policy': 'no-referrer',
        'x-frame-options': 'DENY',
        'cross-origin-opener-policy': 'same-origin',
        'strict-transport-security': 'max-age=31536000; includeSubDomains',
        'x-powered-by': undefined,
      });
      const docs = await t.http().get('/api/docs').set('X-Forwarded-Proto', 'https').expect(200);
      expect(csp(docs.headers['content-security-policy'])).toEqual({
        ...HTTPS_CSP,
        'style-src': "'self' 'unsafe-inline'",
      });
    } finally {
      await t.close();
    }
  });

  it('behind a proxy, sends the https-only headers for requests that came over https only', async () => {
    const t = await startTestApp({ TRUST_PROXY: 'true', WEB_DIST: webDist });
    try {
      const get = (proto: string) =>
        t
          .http()
          .get('/students')
          .set('Accept', 'text/html')
          .set('X-Forwarded-Proto', proto)
          .expect(200);
      const secure = await get('https');
      expect(csp(secure.headers['content-security-policy'])).toEqual(HTTPS_CSP);
      expect(secure.headers['cross-origin-opener-policy']).toBe('same-origin');
      // HSTS pins a name to https for a year: only a production server sends it.
      expect(secure.headers['strict-transport-security']).toBeUndefined();

      const plain = await get('http');
      expect(csp(plain.headers['content-security-policy'])).toEqual(STRICT_CSP);
      expect(plain.headers['cross-origin-opener-policy']).toBeUndefined();
      expect(plain.headers['strict-transport-security']).toBeUndefined();
    } finally {
      await t.close();
    }
  });

  it('ignores X-Forwarded-Proto unless TRUST_PROXY is set', async () => {
    const t = await startTestApp({ TRUST_PROXY: 'false', WEB_DIST: webDist });
    try {
      const page = await t
        .http()
        .get('/students')
        .set('Accept', 'text/html')
        .set('X-Forwarded-Proto', 'https')
        .expect(200);
      expect(csp(page.headers['content-security-policy'])).toEqual(STRICT_CSP);
      expect(page.headers['strict-transport-security']).toBeUndefined();
      expect(page.headers['cross-origin-opener-policy']).toBeUndefined();
    } finally {
      await t.close();
    }
  });

  it('sends the https set on every request when PUBLIC_URL is https', async () => {
    const t = await startTestApp({ PUBLIC_URL: 'https://workback.example', WEB_DIST: webDist });
    try {
      const page = await t.http().get('/students').set('Accept', 'text/html').expect(200);
      expect(pick(page.headers, SECURITY)).toEqual({
        'content-security-policy': HTTPS_CSP,
        'x-content-type-options': 'nosniff',
        'referrer-policy': 'no-referrer',
        'x-frame-options': 'DENY',
        'cross-origin-opener-policy': 'same-origin',
        'strict-transport-security': undefined,
        'x-powered-by': undefined,
      });
    } finally {
      await t.close();
    }
  });
});
