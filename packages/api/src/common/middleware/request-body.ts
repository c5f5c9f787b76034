import {
  type CallHandler,
  type ExecutionContext,
  Injectable,
  mixin,
  type NestInterceptor,
  PayloadTooLargeException,
  type Type,
} from '@nestjs/common';
import express, {
  type NextFunction,
  type Request,
  type RequestHandler,
  type Response,
} from 'express';
import type { Observable } from 'rxjs';
import { inTurn } from './in-turn.js';

/** JSON (and any other body but multipart) may be at most this large. */
export const JSON_BODY_LIMIT_BYTES = 256 * 1024;

function declaredLength(req: Request): number | undefined {
  const raw = req.headers['content-length'];
  return raw !== undefined && /^\d+$/.test(raw) ? Number(raw) : undefined;
}

function refuse(res: Response, status: number, body: object): void {
  // Nothing more of this request's body will be read: close the connection after answering.
  res.setHeader('Connection', 'close');
  res.status(status).json(body);
}

/**
 * Before any body is read: a declared Content-Length over the JSON limit answers 413 at once
 * (body-parser would read the whole body before refusing), and a body still arriving after
 * `timeoutMs` is cut off with 408. Multipart routes check their own larger limit with
 * `DeclaredLengthLimit`.
 */
function requestBodyLimits(timeoutMs: number) {
  return (req: Request, res: Response, next: NextFunction) => {
    const length = declaredLength(req);
    const chunked = req.headers['transfer-encoding'] !== undefined;
    if (!chunked && !length) return next();
    if (length !== undefined && length > JSON_BODY_LIMIT_BYTES && !req.is('multipart/form-data')) {
      refuse(res, 413, {
        statusCode: 413,
        error: 'Payload Too Large',
        message: `The request body is too large (at most ${JSON_BODY_LIMIT_BYTES / 1024} kB)`,
        fields: { body: 'is too large' },
      });
      return;
    }
    const timer = setTimeout(() => {
      if (req.complete || res.headersSent) return;
      refuse(res, 408, {
        statusCode: 408,
        error: 'Request Timeout',
        message:
          'The request arrived too slowly and was cut off: please try again on a steadier connection',
      });
      res.once('finish', () => req.destroy());
    }, timeoutMs);
    timer.unref();
    const clear = () => clearTimeout(timer);
    req.once('end', clear);
    req.once('close', clear);
    res.once('finish', clear);
    next();
  };
}

/**
 * Everything about a request's body, run only when it has one: the limits above, then JSON and
 * urlencoded parsing (Nest's own defaults, which the app asks it not to add). A GET, most of
 * the traffic, skips the lot instead of passing each parser in turn.
 */
export function requestBodies(timeoutMs: number): RequestHandler {
  const bodies = inTurn(
    requestBodyLimits(timeoutMs),
    express.json({ limit: JSON_BODY_LIMIT_BYTES }),
    express.urlencoded({ extended: true }),
  );
  return (req, res, next) =>
    req.headers['transfer-encoding'] !== undefined || declaredLength(req) !== undefined
      ? bodies(req, res, next)
      : next();
}

/**
 * For a multipart route with its own limits: a declared Content-Length over `maxBytes` answers
 * 413 (the route's own refusal, naming its field) before multer reads anything. Put it before
 * the file interceptor.
 */
export function DeclaredLengthLimit(
  maxBytes: number,
  refusal: { message: string; fields: Record<string, string> },
): Type<NestInterceptor> {
  @Injectable()
  class DeclaredLengthLimitInterceptor implements NestInterceptor {
    intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
      const http = context.switchToHttp();
      const length = declaredLength(http.getRequest<Request>());
      if (length !== undefined && length > maxBytes) {
        http.getResponse<Response>().setHeader('Connection', 'close');
        throw new PayloadTooLargeException(refusal);
      }
      return next.handle();
    }
  }
  return mixin(DeclaredLengthLimitInterceptor);
}
