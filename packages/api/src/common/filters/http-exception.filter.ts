import {
  type ArgumentsHost,
  Catch,
  type ExceptionFilter,
  HttpException,
  HttpStatus,
  Logger,
} from '@nestjs/common';
import type { Response } from 'express';
import { UniqueConstraintError } from 'sequelize';

const REASONS: Record<number, string> = {
  400: 'Bad Request',
  401: 'Unauthorized',
  403: 'Forbidden',
  404: 'Not Found',
  409: 'Conflict',
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
}

/** Every error leaves as `{ statusCode, error, message, fields? }` (DESIGN.md). */
@Catch()
export class HttpExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  catch(exception: unknown, host: ArgumentsHost): void {
    const res = host.switchToHttp().getResponse<Response>();
    const body = this.toBody(exception);
    if (body.statusCode >= 500) this.logger.error(exception);
    if (res.headersSent) return;
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
      return body;
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
    if (isBodyParserError(exception)) {
      return {
        statusCode: exception.status,
        error: REASONS[exception.status] ?? 'Bad Request',
        message:
          exception.status === 413
            ? 'The request body is too large'
            : 'The request body is not valid JSON',
      };
    }
    return {
      statusCode: HttpStatus.INTERNAL_SERVER_ERROR,
      error: REASONS[500]!,
      message: 'Something went wrong on our side; nothing was saved',
    };
  }
}

function isBodyParserError(e: unknown): e is { status: number; type: string } {
  return (
    typeof e === 'object' &&
    e !== null &&
    typeof (e as { status?: unknown }).status === 'number' &&
    typeof (e as { type?: unknown }).type === 'string'
  );
}
