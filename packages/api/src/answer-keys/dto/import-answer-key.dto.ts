import { ApiProperty } from '@nestjs/swagger';
import { AnswerKeyFieldsDto } from './create-answer-key.dto.js';

/** The text fields of the multipart import (the file itself comes through multer). */
export class ImportAnswerKeyDto extends AnswerKeyFieldsDto {}

/** For the OpenAPI document only: the whole multipart body. */
export class ImportAnswerKeyBody extends AnswerKeyFieldsDto {
  @ApiProperty({ type: 'string', format: 'binary', description: 'CSV, UTF-8, at most 2 MiB' })
  file: unknown;
}
