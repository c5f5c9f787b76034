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
import { ApiConsumes } from '@nestjs/swagger';
import { FilesInterceptor } from '@nestjs/platform-express';
import { memoryStorage } from 'multer';
import { catchError, type Observable, throwError } from 'rxjs';
import { DeclaredLengthLimit } from '../common/middleware/request-body.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { MAX_PHOTO_BYTES, MAX_PHOTOS_PER_MISS } from './photo-limits.js';

export const PHOTOS_FIELD = 'photos';
/** The text fields and multipart framing around the photos (20 fields of up to 64 KiB). */
const FORM_ROOM_BYTES = 20 * 64 * 1024 + 64 * 1024;

/** Turns multer's refusals into our error body, naming the field. */
@Injectable()
export class UploadErrorsInterceptor implements NestInterceptor {
  intercept(_context: ExecutionContext, next: CallHandler): Observable<unknown> {
    return next.handle().pipe(catchError((err: unknown) => throwError(() => explain(err))));
  }
}

function explain(err: unknown): unknown {
  if (!(err instanceof HttpException)) return err;
  const cause = err.cause as { code?: string; field?: string } | undefined;
  const field = cause?.field ?? PHOTOS_FIELD;
  switch (cause?.code) {
    case 'LIMIT_FILE_SIZE':
      return new PayloadTooLargeException({
        message: `Each photo may be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MiB`,
        fields: { [PHOTOS_FIELD]: `a photo is over ${MAX_PHOTO_BYTES / 1024 / 1024} MiB` },
      });
    case 'LIMIT_FILE_COUNT':
      return fieldsError({ [PHOTOS_FIELD]: `attach at most ${MAX_PHOTOS_PER_MISS} photos` });
    case 'LIMIT_UNEXPECTED_FILE':
      return field === PHOTOS_FIELD
        ? fieldsError({ [PHOTOS_FIELD]: `attach at most ${MAX_PHOTOS_PER_MISS} photos` })
        : fieldsError({ [field]: `is not a file field; send photos as "${PHOTOS_FIELD}"` });
    case 'LIMIT_FIELD_VALUE':
      return fieldsError({ [field]: 'is too long' });
    case 'LIMIT_FIELD_COUNT':
    case 'LIMIT_PART_COUNT':
      return fieldsError({ form: 'has too many fields' });
    default:
      return err;
  }
}

/** Multipart `photos` (at most 4, 10 MiB each: multer stops reading past that and answers 413). */
export const PhotoUpload = () =>
  applyDecorators(
    ApiConsumes('multipart/form-data', 'application/json'),
    UseInterceptors(
      DeclaredLengthLimit(MAX_PHOTOS_PER_MISS * MAX_PHOTO_BYTES + FORM_ROOM_BYTES, {
        message: `Attach at most ${MAX_PHOTOS_PER_MISS} photos of ${MAX_PHOTO_BYTES / 1024 / 1024} MiB each`,
        fields: { [PHOTOS_FIELD]: `more than ${MAX_PHOTOS_PER_MISS} photos' worth of bytes` },
      }),
      UploadErrorsInterceptor,
      FilesInterceptor(PHOTOS_FIELD, MAX_PHOTOS_PER_MISS, {
        storage: memoryStorage(),
        limits: {
          fileSize: MAX_PHOTO_BYTES,
          files: MAX_PHOTOS_PER_MISS,
          fields: 20,
          fieldSize: 64 * 1024,
          parts: 40,
        },
      }),
    ),
  );
