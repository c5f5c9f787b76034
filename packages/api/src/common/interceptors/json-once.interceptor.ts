import {
  type CallHandler,
  type ExecutionContext,
  Injectable,
  type NestInterceptor,
} from '@nestjs/common';
import type { Response } from 'express';
import { map, type Observable } from 'rxjs';

/** Answers already written, by the object they were written from. */
const written = new WeakMap<object, string>();

/**
 * For a route that answers objects kept between requests (the notebook's page cache): each
 * object is turned into JSON once, and the same text is sent for as long as it is kept. The
 * objects must not change once answered; a changed answer is a new object.
 */
@Injectable()
export class JsonOnceInterceptor implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    const res = context.switchToHttp().getResponse<Response>();
    return next.handle().pipe(
      map((body: unknown) => {
        if (typeof body !== 'object' || body === null) return body;
        let json = written.get(body);
        if (json === undefined) written.set(body, (json = JSON.stringify(body)));
        // A string is sent as it is (not encoded again) under the type set here.
        res.type('application/json');
        return json;
      }),
    );
  }
}
