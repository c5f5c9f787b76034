import {
  type ArgumentsHost,
  Catch,
  type ExceptionFilter,
  HttpException,
  HttpStatus,
  Logger,
} from '@nestjs/common';
import type { Request, Response } from 'express';
import { MetricsService } from '../../metrics/metrics.service.js';
import {
  ConnectionError,
  DatabaseError,
  ForeignKeyConstraintError,
  UniqueConstraintError,
  ValidationError,
} from 'sequelize';

const REASONS: Record<number, string> = {
  400: 'Bad Request',
  401: 'Unauthorized',
  403: 'Forbidden',
  404: 'Not Found',
  408: 'Request Timeout',
  409: 'Conflict',
  410: 'Gone',
  413: 'Payload Too Large',
  415: 'Unsupported Media Type',
  422: 'Unprocessable Entity',
  429: 'Too Many Requests',
  500: 'Internal Server Error',
  503: 'Service Unavailable',
  507: 'Insufficient Storage',
};

export interface ErrorBody {
  statusCode: number;
  error: string;
  message: string;
  fields?: Record<string, string>;
  /** Seconds, sent as Retry-After (not in the body): the fault passes, the request can be sent again. */
  retryAfter?: number;
}

/** Every error leaves as `{ statusCode, error, message, fields? }` (DESIGN.md). */
@Catch()
export class HttpExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  constructor(private readonly metrics: MetricsService) {}

  catch(exception: unknown, host: ArgumentsHost): void {
    this.respond(
      exception,
      host.switchToHttp().getRequest<Request>(),
      host.switchToHttp().getResponse<Response>(),
    );
  }

  /** Also for errors of the Express middleware before Nest's routes (the session store's). */
  respond(exception: unknown, req: Request, res: Response): void {
    const { retryAfter, ...body } = this.toBody(exception);
    // Only what identifies the fault: errors from the ORM carry row values (children's data).
    if (body.statusCode >= 500) {
      const e = exception instanceof Error ? exception : new Error(String(exception));
      this.logger.error({
        reqId: req.id,
        name: e.name,
        message: e.message,
        code: faultCode(exception),
        stack: e.stack,
      });
    }
    if (res.headersSent) return;
    if (retryAfter) res.setHeader('Retry-After', String(retryAfter));
    res.status(body.statusCode).json(body);
  }

  private toBody(exception: unknown): ErrorBody {
    if (exception instanceof HttpException) {
      const statusCode = exception.getStatus();
      const raw = exception.getResponse();
      const payload = typeof raw === 'string' ? { message: raw } : (raw as Record<string, unknown>);
      const message = Array.isArray(payload.message)
        ? payload.message.join('; ')
        : String(payload.message ?? exception.message);
      const body: ErrorBody = { statusCode, error: REASONS[statusCode] ?? 'Error', message };
      if (payload.fields && typeof payload.fields === 'object') {
        body.fields = payload.fields as Record<string, string>;
      }
      return withRequestFault(body, exception.cause);
    }
    if (exception instanceof UniqueConstraintError) {
      const field = exception.errors[0]?.path ?? 'value';
      return {
        statusCode: HttpStatus.CONFLICT,
        error: REASONS[409]!,
        message: `That ${field} is already in use`,
        fields: { [field]: 'is already in use' },
      };
    }
    if (exception instanceof ValidationError) {
      // A value the DTO let through but the model refuses (e.g. null for a required column).
      const fields = Object.fromEntries(
        exception.errors.map((e) => [e.path ?? 'value', `${e.path ?? 'value'} must not be empty`]),
      );
      return {
        statusCode: HttpStatus.BAD_REQUEST,
        error: REASONS[400]!,
        message: `Please check ${Object.keys(fields).join(', ')}`,
        fields,
      };
    }
    if (exception instanceof ForeignKeyConstraintError) {
      return {
        statusCode: HttpStatus.CONFLICT,
        error: REASONS[409]!,
        message: 'Something else still refers to this, or it refers to something that is gone',
      };
    }
    const storage = storageFault(exception);
    if (storage) {
      this.countFault(exception);
      return storage;
    }
    return {
      statusCode: HttpStatus.INTERNAL_SERVER_ERROR,
      error: REASONS[500]!,
      message: 'Something went wrong on our side; nothing was saved',
    };
  }

  private countFault(exception: unknown): void {
    if (faultCode(exception) === 'SQLITE_BUSY') this.metrics.countSqliteBusy();
    else this.metrics.countStorageFault();
  }
}

function faultCode(exception: unknown): unknown {
  if (exception instanceof DatabaseError || exception instanceof ConnectionError) {
    return (exception.parent as { code?: string } | undefined)?.code;
  }
  return (exception as { code?: unknown } | null)?.code;
}

/**
 * PostgreSQL's SQLSTATEs (and the network's errors) that say "not now" rather than "wrong":
 * another transaction won (serialization failure, deadlock), a lock or statement waited past
 * its timeout, the server is shutting down, restarting or out of connections, or the
 * connection broke. The transaction was rolled back whole; the same request can be sent again.
 */
const POSTGRES_BUSY = new Set(['40001', '40P01', '55P03', '57014']);
const DATABASE_GONE = new Set([
  '57P01',
  '57P02',
  '57P03',
  '53300',
  '53400',
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'ENOTFOUND',
  'EAI_AGAIN',
  'EHOSTUNREACH',
]);

/** The connection dropped under a query: pg's errors for it carry no code, only these words. */
const BROKEN_CONNECTION =
  /Connection terminated|not queryable|terminating connection|Connection refused|timeout exceeded when trying to connect/i;

function databaseUnavailable(exception: unknown): ErrorBody | undefined {
  const code = faultCode(exception);
  if (code === 'SQLITE_BUSY' || (typeof code === 'string' && POSTGRES_BUSY.has(code))) {
    // Another write held the database past its wait; the request was rolled back whole.
    return {
      statusCode: HttpStatus.SERVICE_UNAVAILABLE,
      error: REASONS[503]!,
      message: 'The notebook is busy with other changes, so nothing was saved. Please try again.',
      retryAfter: 2,
    };
  }
  const cause =
    exception instanceof DatabaseError || exception instanceof ConnectionError
      ? exception.parent
      : exception;
  if (
    exception instanceof ConnectionError ||
    (typeof code === 'string' && (DATABASE_GONE.has(code) || code.startsWith('08'))) ||
    (cause instanceof Error && !code && BROKEN_CONNECTION.test(cause.message))
  ) {
    return {
      statusCode: HttpStatus.SERVICE_UNAVAILABLE,
      error: REASONS[503]!,
      message:
        'The server cannot reach its database right now, so nothing was saved. Please try again in a minute.',
      retryAfter: 30,
    };
  }
  return undefined;
}

/** Express maps broken JSON and broken %-escapes to 400s with parser wording; name what was wrong. */
function withRequestFault(body: ErrorBody, cause: unknown): ErrorBody {
  if (cause instanceof SyntaxError && body.statusCode === 400) {
    return {
      ...body,
      message: 'The request body must be a JSON object',
      fields: { body: 'must be a JSON object' },
    };
  }
  if (cause instanceof URIError) {
    return {
      ...body,
      message: 'The address has a broken %-escape',
      fields: { path: 'is not valid' },
    };
  }
  if (body.statusCode === 413 && !body.fields) {
    return { ...body, message: 'The request body is too large', fields: { body: 'is too large' } };
  }
  return body;
}

/**
 * A full disk, a read-only data folder, a database held too long by another writer, or a
 * PostgreSQL that is busy or out of reach: the write was refused whole and can be retried later.
 */
function storageFault(exception: unknown): ErrorBody | undefined {
  const unavailable = databaseUnavailable(exception);
  if (unavailable) return unavailable;
  const code = faultCode(exception);
  if (code === 'SQLITE_FULL' || code === 'ENOSPC') {
    return {
      statusCode: 507,
      error: REASONS[507]!,
      message:
        'The server has run out of storage space, so nothing was saved. Please tell the site admin.',
    };
  }
  if (
    code === 'SQLITE_READONLY' ||
    code === 'EROFS' ||
    code === 'SQLITE_IOERR' ||
    code === 'SQLITE_CANTOPEN'
  ) {
    return {
      statusCode: HttpStatus.SERVICE_UNAVAILABLE,
      error: REASONS[503]!,
      message:
        'The server cannot write its data right now, so nothing was saved. Please try again later.',
    };
  }
  return undefined;
}
