import http from 'node:http';
import type { AddressInfo } from 'node:net';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { postMultipart } from './support/photos.js';
import { type Client, DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

// Small limits through configuration (issue 13 §3): half a second for a body, 1 megapixel of
// photos per request.
let t: TestApp;
let owner: Client;
let studentId: number;

beforeAll(async () => {
  t = await startTestApp({
    SIGN_IN_LIMIT_PER_MINUTE: '1000',
    BODY_TIMEOUT_SECONDS: '0.5',
    PHOTO_MEGAPIXELS_PER_REQUEST: '1',
  });
  owner = await signedIn(t, DEMO.owner);
  studentId = (await owner.get('/api/students').expect(200)).body.items[0].id;
});
afterAll(() => t.close());

interface RawAnswer {
  status: number;
  body: { statusCode?: number; message?: string; fields?: Record<string, string> };
  connection: string | undefined;
}

/** Sends headers and then only `bodyStart` of the declared body, and waits for the answer. */
function partialRequest(
  path: string,
  headers: Record<string, string>,
  bodyStart = '',
): Promise<RawAnswer> {
  const { port } = t.app.getHttpServer().address() as AddressInfo;
  return new Promise((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        path,
        method: 'POST',
        headers: { cookie: owner.cookie, 'x-csrf-token': owner.token, ...headers },
      },
      (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (text += c));
        res.on('end', () => {
          req.destroy();
          resolve({
            status: res.statusCode!,
            body: JSON.parse(text) as RawAnswer['body'],
            connection: res.headers.connection,
          });
        });
      },
    );
    req.on('error', reject);
    req.flushHeaders();
    if (bodyStart) req.write(bodyStart);
  });
}

async function missCount(): Promise<number> {
  return (await owner.get(`/api/misses?studentId=${studentId}&pageSize=1`).expect(200)).body
    .total as number;
}

describe('request bodies', () => {
  it('answers 413 to a declared JSON body over the limit without waiting for it', async () => {
    const res = await partialRequest('/api/students', {
      'content-type': 'application/json',
      'content-length': String(50 * 1024 * 1024),
    });
    expect(res.status).toBe(413);
    expect(res.body.fields).toEqual({ body: 'is too large' });
    expect(res.connection).toBe('close');
  });

  it('answers 413 to a declared upload over the photo route’s limit, naming photos', async () => {
    const res = await partialRequest('/api/misses', {
      'content-type': 'multipart/form-data; boundary=x',
      'content-length': String(200 * 1024 * 1024),
    });
    expect(res.status).toBe(413);
    expect(res.body.fields).toHaveProperty('photos');
  });

  it('answers 413 to a declared key file over its limit, naming file', async () => {
    const res = await partialRequest('/api/answer-keys/import', {
      'content-type': 'multipart/form-data; boundary=x',
      'content-length': String(20 * 1024 * 1024),
    });
    expect(res.status).toBe(413);
    expect(res.body.fields).toEqual({ file: 'is over 2 MiB' });
  });

  it('cuts off a body that trickles in with 408', async () => {
    const before = await missCount();
    const res = await partialRequest(
      '/api/students',
      { 'content-type': 'application/json', 'content-length': '200' },
      '{"name":"Tr',
    );
    expect(res.status).toBe(408);
    expect(res.body).toMatchObject({ statusCode: 408 });
    expect(res.body.message).toMatch(/too slowly/);
    const upload = await partialRequest(
      '/api/misses',
      { 'content-type': 'multipart/form-data; boundary=x', 'content-length': '100000' },
      '--x\r\nContent-Disposition: form-data; name="problem"\r\n\r\n12 - 5\r\n',
    );
    expect(upload.status).toBe(408);
    expect(await missCount()).toBe(before);
  });
});

describe('photo pixels per request', () => {
  // A flat PNG compresses to almost nothing however many pixels it has: the budget counts
  // pixels, not bytes.
  const png = (side: number) =>
    sharp({ create: { width: side, height: side, channels: 3, background: '#ffffff' } })
      .png({ compressionLevel: 9 })
      .toBuffer();

  it('refuses photos over the budget together with 413 naming photos, and saves nothing', async () => {
    const before = await missCount();
    const small = await png(800);
    expect(small.length).toBeLessThan(20_000);
    const fields = { studentId, occurredOn: '2026-03-02', problem: '12 - 5', answer: '8' };
    const photos = [
      { name: 'a.png', data: small, type: 'image/png' },
      { name: 'b.png', data: small, type: 'image/png' },
    ];
    const res = await postMultipart(owner, '/api/misses', fields, photos);
    expect(res.status).toBe(413);
    expect(res.body.fields).toHaveProperty('photos');
    expect(res.body.message).toMatch(/over 1 megapixels/);
    expect(await missCount()).toBe(before);

    const one = await postMultipart(owner, '/api/misses', fields, photos.slice(0, 1));
    expect(one.status, one.text).toBe(201);
  });

  it('leaves an empty file to the usual refusal (415), not a 500', async () => {
    const fields = { studentId, occurredOn: '2026-03-02', problem: '12 - 5', answer: '8' };
    const res = await postMultipart(owner, '/api/misses', fields, [
      { name: 'a.jpg', data: Buffer.alloc(0) },
    ]);
    expect(res.status, res.text).toBe(415);
  });
});
