import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { MAX_KEY_ITEMS } from '@workback/core';
import { Transform, Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsIn,
  IsInt,
  IsOptional,
  IsString,
  Length,
  Matches,
  Max,
  Min,
  ValidateNested,
} from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { KEY_KINDS, type KeyKind } from '../models/answer-key.model.js';
import { KeyItemDto } from './key-item.dto.js';

// One limit for typed keys and imported files (core's key CSV rules hold it).
export { MAX_KEY_ITEMS };

/** Multipart fields arrive as text: `'3'` → 3, `''` → left out. */
const wholeFromText = ({ value }: { value: unknown }) =>
  typeof value === 'string' && /^\s*\d+\s*$/.test(value)
    ? Number(value)
    : value === ''
      ? undefined
      : value;

/** What a key is, without its items: shared by JSON creation and CSV import. */
export class AnswerKeyFieldsDto {
  @ApiProperty({ example: 'Worksheet 14', maxLength: 120 })
  @Trim()
  @Length(1, 120, { message: 'title must be 1 to 120 characters' })
  @Matches(/\S/, { message: 'title must not be blank' })
  @IsString()
  title: string;

  @ApiProperty({ enum: KEY_KINDS })
  @IsIn(KEY_KINDS, { message: `kind must be one of ${KEY_KINDS.join(', ')}` })
  kind: KeyKind;

  @ApiPropertyOptional({ example: 3, nullable: true })
  @IsOptional()
  @Transform(wholeFromText)
  @IsInt({ message: 'courseId must be a whole number' })
  courseId?: number | null;

  @ApiPropertyOptional({ example: 14, nullable: true })
  @IsOptional()
  @Transform(wholeFromText)
  @Min(1, { message: 'lessonNumber must be 1 or more' })
  @Max(9999, { message: 'lessonNumber must be at most 9999' })
  @IsInt({ message: 'lessonNumber must be a whole number' })
  lessonNumber?: number | null;
}

export class CreateAnswerKeyDto extends AnswerKeyFieldsDto {
  @ApiProperty({ type: [KeyItemDto] })
  @Type(() => KeyItemDto)
  @ArrayMaxSize(MAX_KEY_ITEMS, { message: `a key holds at most ${MAX_KEY_ITEMS} items` })
  @ValidateNested({ each: true })
  @IsArray({ message: 'items must be a list' })
  items: KeyItemDto[];
}
