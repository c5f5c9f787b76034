import { randomUUID } from 'node:crypto';
import type { LoggerService } from '@nestjs/common';
import type { NextFunction, Request, Response } from 'express';
import { type DestinationStream, type Level, type Logger, type LoggerOptions, pino } from 'pino';

declare module 'express-serve-static-core' {
  interface Request {
    /** This request's id, also sent back as x-request-id and written on its log line. */
    id?: string;
  }
}

/** Never logged, even at debug: credentials and session ids. */
const REDACT = ['req.headers.cookie', 'req.headers["x-csrf-token"]', 'res.headers["set-cookie"]'];

/**
 * The process's logger. JSON lines on stdout (production, tests, anything piped); when a
 * person runs the development server in a terminal, one coloured line per entry through
 * pino-pretty instead.
 */
export function createLogger(
  level: string,
  pretty: boolean,
  destination?: DestinationStream,
): Logger {
  const options: LoggerOptions = {
    level,
    base: undefined,
    redact: REDACT,
    transport: pretty
      ? {
          target: 'pino-pretty',
          options: {
            singleLine: true,
            translateTime: 'SYS:HH:MM:ss.l',
            ignore: 'method,route,status,ms',
            messageFormat: '{if method}{method} {route} {status} {ms} ms{end}{msg}',
          },
        }
      : undefined,
  };
  if (pretty) return pino(options);
  if (destination) return pino(options, destination);
  // Written asynchronously in 4 KiB batches instead of one blocking write per line, flushed at
  // least every second so a quiet server's lines still show; pino flushes the rest on exit.
  const stdout = pino.destination({ dest: 1, sync: false, minLength: 4096 });
  setInterval(() => stdout.flush(), 1000).unref();
  return pino(options, stdout);
}

/** The route a request matched ('/api/misses/:id'), not its URL: ids and search words stay out. */
function routeOf(req: Request): string {
  const pattern = (req.route as { path?: unknown } | undefined)?.path;
  return typeof pattern === 'string' ? `${req.baseUrl}${pattern}` : req.path;
}

/**
 * One compact line per request when it ends: method, route, status, ms and the request id
 * (also sent as x-request-id). Full request and response headers only at debug. `onFinished`
 * hears of each response sent in full, from the same listener (one per request, not one each).
 */
export function requestLog(logger: Logger, onFinished?: (req: Request, status: number) => void) {
  return (req: Request, res: Response, next: NextFunction) => {
    const started = performance.now();
    const id = randomUUID();
    req.id = id;
    res.setHeader('x-request-id', id);
    res.once('close', () => {
      const status = res.writableFinished ? res.statusCode : 499;
      if (res.writableFinished) onFinished?.(req, status);
      const level: Level = status >= 500 ? 'error' : 'info';
      if (!logger.isLevelEnabled(level)) return;
      const line: Record<string, unknown> = {
        reqId: id,
        method: req.method,
        route: routeOf(req),
        status,
        ms: Math.round((performance.now() - started) * 10) / 10,
      };
      if (logger.isLevelEnabled('debug')) {
        line.req = { url: req.originalUrl, headers: req.headers };
        line.res = { headers: res.getHeaders() };
      }
      logger[level](line);
    });
    next();
  };
}

const NEST_LEVELS = {
  log: 'info',
  error: 'error',
  warn: 'warn',
  debug: 'debug',
  verbose: 'trace',
  fatal: 'fatal',
} as const;

/** Nest's own messages (start-up, `new Logger(...)` in services) through the same pino logger. */
export class PinoNestLogger implements LoggerService {
  constructor(private readonly logger: Logger) {}

  log(message: unknown, ...params: unknown[]) {
    this.write('log', message, params);
  }
  error(message: unknown, ...params: unknown[]) {
    this.write('error', message, params);
  }
  warn(message: unknown, ...params: unknown[]) {
    this.write('warn', message, params);
  }
  debug(message: unknown, ...params: unknown[]) {
    this.write('debug', message, params);
  }
  verbose(message: unknown, ...params: unknown[]) {
    this.write('verbose', message, params);
  }
  fatal(message: unknown, ...params: unknown[]) {
    this.write('fatal', message, params);
  }

  private write(kind: keyof typeof NEST_LEVELS, message: unknown, params: unknown[]) {
    const level = NEST_LEVELS[kind];
    if (!this.logger.isLevelEnabled(level)) return;
    // Nest passes the context last, and for errors a stack before it.
    const rest = [...params];
    const context = typeof rest.at(-1) === 'string' ? (rest.pop() as string) : undefined;
    const stack = kind === 'error' && typeof rest[0] === 'string' ? rest[0] : undefined;
    if (message instanceof Error) {
      this.logger[level]({ context, err: message });
    } else if (typeof message === 'object' && message !== null) {
      this.logger[level]({ context, ...message });
    } else {
      this.logger[level]({ context, ...(stack ? { stack } : {}) }, String(message));
    }
  }
}
