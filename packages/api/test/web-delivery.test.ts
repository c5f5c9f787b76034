import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { get, type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliCompressSync, brotliDecompressSync, gunzipSync, gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

// A built web app as Vite leaves it: hashed files under assets/ with .br and .gz beside them.
const webDist = mkdtempSync(path.join(tmpdir(), 'workback-web-'));
const script = `export const rows = ${JSON.stringify(Array.from({ length: 400 }, (_, i) => `row ${i}`))};\n`;
mkdirSync(path.join(webDist, 'assets'));
writeFileSync(path.join(webDist, 'index.html'), '<!doctype html><title>Workback</title>');
writeFileSync(path.join(webDist, 'assets/notebook-3f9a1c.js'), script);
writeFileSync(path.join(webDist, 'assets/notebook-3f9a1c.js.br'), brotliCompressSync(script));
writeFileSync(path.join(webDist, 'assets/notebook-3f9a1c.js.gz'), gzipSync(script));
writeFileSync(path.join(webDist, 'sw.js'), '// not hashed\n');

/** A GET that keeps the body as it came over the wire (supertest would decode it). */
function wire(
  pathname: string,
  headers: Record<string, string>,
): Promise<{ status: number; headers: IncomingHttpHeaders; body: Buffer }> {
  const { port } = t.app.getHttpServer().address() as AddressInfo;
  return new Promise((done, fail) => {
    get({ host: '127.0.0.1', port, path: pathname, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () =>
        done({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }),
      );
    }).on('error', fail);
  });
}

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ WEB_DIST: webDist });
});
afterAll(async () => {
  await t?.close();
  rmSync(webDist, { recursive: true, force: true });
});

describe('delivering the web app', () => {
  it('serves hashed assets precompressed (brotli first, then gzip) and cached for a year', async () => {
    const br = await wire('/assets/notebook-3f9a1c.js', { 'Accept-Encoding': 'gzip, deflate, br' });
    expect(br.status).toBe(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers['content-type']).toMatch(/^text\/javascript|^application\/javascript/);
    expect(br.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(br.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(brotliDecompressSync(br.body).toString()).toBe(script);

    const gz = await wire('/assets/notebook-3f9a1c.js', { 'Accept-Encoding': 'gzip' });
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.body).toString()).toBe(script);

    const plain = await wire('/assets/notebook-3f9a1c.js', { 'Accept-Encoding': 'identity' });
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString()).toBe(script);
  });

  it('has the browser check index.html and other unhashed files with the server on every use', async () => {
    const page = await t.http().get('/notebook').set('Accept', 'text/html').expect(200);
    expect(page.headers['cache-control']).toBe('no-cache');
    const worker = await t.http().get('/sw.js').expect(200);
    expect(worker.headers['cache-control']).toBe('no-cache');
  });

  it('compresses API JSON, keeping it uncached', async () => {
    const owner = await signedIn(t, DEMO.owner);
    const res = await wire('/api/misses?pageSize=100', {
      'Accept-Encoding': 'br',
      Cookie: owner.cookie,
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['cache-control']).toBe('no-store');
    const body = JSON.parse(brotliDecompressSync(res.body).toString()) as {
      items: unknown[];
    };
    expect(body.items.length).toBeGreaterThan(0);
  });

  it('leaves zip downloads as they are', async () => {
    const owner = await signedIn(t, DEMO.owner);
    const zip = await wire('/api/export', { 'Accept-Encoding': 'gzip, br', Cookie: owner.cookie });
    expect(zip.status).toBe(200);
    expect(zip.headers['content-type']).toBe('application/zip');
    expect(zip.headers['content-encoding']).toBeUndefined();
    // "PK\x03\x04": the zip's own first bytes, not a compressed stream of them.
    expect(zip.body.subarray(0, 4).toString('latin1')).toBe('PK\u0003\u0004');
  });
});
