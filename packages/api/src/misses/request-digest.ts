import { createHash } from 'node:crypto';
import type { UploadedPhoto } from '../photos/photos.service.js';
import type { CreateMissDto } from './dto/create-miss.dto.js';

/** SHA-256 over the validated fields (in a fixed order) and every photo's bytes. */
export function requestDigest(dto: CreateMissDto, files: readonly UploadedPhoto[]): string {
  const hash = createHash('sha256');
  hash.update(
    JSON.stringify([
      dto.studentId,
      dto.occurredOn,
      dto.problem,
      dto.answer,
      dto.steps ?? null,
      dto.explanation ?? '',
      dto.cause ?? null,
      dto.note ?? '',
      dto.status ?? null,
      dto.skills ?? [],
      dto.revisit ?? [],
      // Only when sent, so a key used before word problems existed keeps its digest.
      ...(dto.lines !== undefined || dto.stage !== undefined
        ? [dto.lines ?? [], dto.stage ?? null]
        : []),
    ]),
  );
  for (const file of files) {
    hash.update(`\0${file.buffer.length}\0`);
    hash.update(file.buffer);
  }
  return hash.digest('hex');
}
