import {
  type CallHandler,
  type ExecutionContext,
  Injectable,
  type NestInterceptor,
} from '@nestjs/common';
import type { Response } from 'express';
import { map, type Observable } from 'rxjs';

/** Answers already written, with their ETag, by the object they were written from. */
const written = new WeakMap<object, { json: string; etag: string | undefined }>();

type ETagFn = (body: string, encoding: BufferEncoding) => string | undefined;

/**
 * For a route that answers objects kept between requests (the notebook's page cache): each
 * object is turned into JSON (and its ETag) once, and the same text is sent for as long as it
 * is kept; a request that sends the ETag back still gets its 304 from Express. The
 * objects must not change once answered; a changed answer is a new object.
 */
@Injectable()
export class JsonOnceInterceptor implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    const res = context.switchToHttp().getResponse<Response>();
    return next.handle().pipe(
      map((body: unknown) => {
        if (typeof body !== 'object' || body === null) return body;
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
      }),
    );
  }
}
