import { gzipSync } from 'node:zlib';
import type { Request, Response } from 'express';

/** An answer already written, with its ETag, and gzipped once a browser has asked for it so. */
interface Written {
  json: string;
  etag: string | undefined;
  /** The JSON as UTF-8, encoded once: a string is encoded again on every write to the socket. */
  plain?: Representation;
  gzip?: Representation;
}

/** Bytes sent as they are, with the ETag of those bytes. */
interface Representation {
  bytes: Buffer;
  etag: string | undefined;
}

/** Answers already written, by the object they were written from. */
const written = new WeakMap<object, Written>();

/** Shorter JSON is sent as it is: gzip saves too little (compression's own threshold, 1 kB). */
const GZIP_FROM_CHARS = 1024;

type ETagFn = (body: string | Buffer, encoding?: BufferEncoding) => string | undefined;

/**
 * For a route that answers objects kept between requests (the notebook's page cache, health's
 * fixed answer): each object is turned into JSON (and its ETag) once, and the same text is
 * returned for as long as it is kept. The route returns the text with `@Res({ passthrough: true })`;
 * a request that sends the ETag back still gets its 304 from Express. The objects must not
 * change once answered; a changed answer is a new object.
 *
 * A plain function rather than an interceptor: any interceptor puts the route's every request
 * through Nest's rxjs chain, which cost more than the JSON it saved on these hot routes.
 */
export function jsonOnce(res: Response, body: object): string {
  const answer = writtenOnce(res, body);
  // A string is sent as it is (not encoded again) under the type set here.
  jsonHeaders(res, answer.etag);
  return answer.json;
}

/**
 * jsonOnce's answer, sent by the route itself (`@Res()`), gzipped once for every browser that
 * accepts gzip (all do): the compression middleware would otherwise gzip the same kept page
 * again on every request. It sees the answer already encoded and leaves it. The gzipped bytes
 * have their own ETag, as a different representation must (RFC 9110, 8.8.3).
 */
export function sendJsonOnce(res: Response, body: object): void {
  res.vary('Accept-Encoding');
  const answer = writtenOnce(res, body);
  let sent: Representation;
  if (answer.json.length >= GZIP_FROM_CHARS && acceptsGzip(res.req)) {
    sent = answer.gzip ??= gzipOf(res, answer.json);
    res.setHeader('Content-Encoding', 'gzip');
  } else {
    sent = answer.plain ??= { bytes: Buffer.from(answer.json), etag: answer.etag };
  }
  jsonHeaders(res, sent.etag);
  res.send(sent.bytes);
}

function jsonHeaders(res: Response, etag: string | undefined): void {
  if (etag) res.setHeader('ETag', etag);
  res.type('application/json');
}

function writtenOnce(res: Response, body: object): Written {
  let answer = written.get(body);
  if (!answer) {
    const json = JSON.stringify(body);
    // Express's own ETag for the text, which it then does not compute again.
    answer = { json, etag: etagFn(res)?.(json, 'utf8') };
    written.set(body, answer);
  }
  return answer;
}

function gzipOf(res: Response, json: string): Representation {
  const bytes = gzipSync(json);
  return { bytes, etag: etagFn(res)?.(bytes) };
}

/** No Accept-Encoding, or gzip refused (`gzip;q=0`), is answered as plain JSON. */
export function acceptsGzip(req: Request): boolean {
  return !!req.headers['accept-encoding'] && req.acceptsEncodings('gzip') === 'gzip';
}

function etagFn(res: Response): ETagFn | undefined {
  return res.app.get('etag fn') as ETagFn | undefined;
}
