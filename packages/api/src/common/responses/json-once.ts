import type { Response } from 'express';

/** Answers already written, with their ETag, by the object they were written from. */
const written = new WeakMap<object, { json: string; etag: string | undefined }>();

type ETagFn = (body: string, encoding: BufferEncoding) => string | undefined;

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
  let answer = written.get(body);
  if (!answer) {
    const json = JSON.stringify(body);
    // Express's own ETag for the text, which it then does not compute again.
    const etag = (res.app.get('etag fn') as ETagFn | undefined)?.(json, 'utf8');
    written.set(body, (answer = { json, etag }));
  }
  if (answer.etag) res.setHeader('ETag', answer.etag);
  // A string is sent as it is (not encoded again) under the type set here.
  res.type('application/json');
  return answer.json;
}
