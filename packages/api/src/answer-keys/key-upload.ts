import {
  applyDecorators,
  type CallHandler,
  type ExecutionContext,
  HttpException,
  Injectable,
  type NestInterceptor,
  PayloadTooLargeException,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiConsumes } from '@nestjs/swagger';
import { memoryStorage } from 'multer';
import { catchError, type Observable, throwError } from 'rxjs';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { DeclaredLengthLimit } from '../common/middleware/request-body.js';

export const MAX_CSV_BYTES = 2 * 1024 * 1024;
const TOO_LARGE = { message: 'The CSV may be at most 2 MiB', fields: { file: 'is over 2 MiB' } };

/** Multer's refusals in our words, naming the field. */
@Injectable()
export class KeyUploadErrorsInterceptor implements NestInterceptor {
  intercept(_context: ExecutionContext, next: CallHandler): Observable<unknown> {
    return next.handle().pipe(catchError((err: unknown) => throwError(() => explain(err))));
  }
}

function explain(err: unknown): unknown {
  if (!(err instanceof HttpException)) return err;
  const cause = err.cause as { code?: string; field?: string } | undefined;
  switch (cause?.code) {
    case 'LIMIT_FILE_SIZE':
      return new PayloadTooLargeException(TOO_LARGE);
    case 'LIMIT_FILE_COUNT':
    case 'LIMIT_UNEXPECTED_FILE':
      return fieldsError({
        [cause.field ?? 'file']: 'attach exactly one CSV, in the field “file”',
      });
    case 'LIMIT_FIELD_VALUE':
      return fieldsError({ [cause.field ?? 'form']: 'is too long' });
    case 'LIMIT_FIELD_COUNT':
    case 'LIMIT_PART_COUNT':
      return fieldsError({ form: 'has too many fields' });
    default:
      return err;
  }
}

/** Multipart `file`: one CSV up to 2 MiB, held in memory (multer stops reading past that: 413). */
export const KeyUpload = () =>
  applyDecorators(
    ApiConsumes('multipart/form-data'),
    UseInterceptors(
      DeclaredLengthLimit(MAX_CSV_BYTES + 64 * 1024, TOO_LARGE),
      KeyUploadErrorsInterceptor,
      FileInterceptor('file', {
        storage: memoryStorage(),
        limits: { fileSize: MAX_CSV_BYTES, files: 1, fields: 10, fieldSize: 4096, parts: 12 },
      }),
    ),
  );
