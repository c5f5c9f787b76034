import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsInt, IsString, Length, Matches, Max, Min } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { trimList } from '../../curriculum/dto/create-lesson.dto.js';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';

const numbersAsText = ({ value }: { value: unknown }) =>
  Array.isArray(value)
    ? value.map((v) => (typeof v === 'number' ? String(v) : typeof v === 'string' ? v.trim() : v))
    : value;

/** One numbered item of an answer key, as typed or imported. */
export class KeyItemDto {
  @ApiProperty({ example: 12, minimum: 1, maximum: 999 })
  @Min(1, { message: 'number must be 1 or more' })
  @Max(999, { message: 'number must be at most 999' })
  @IsInt({ message: 'number must be a whole number' })
  number: number;

  @ApiProperty({ example: '47 x 24', maxLength: 200 })
  @Trim()
  @Length(1, 200, { message: 'prompt must be 1 to 200 characters' })
  @Matches(/^[^\r\n]*$/, { message: 'prompt must be on one line' })
  @IsString({ message: 'prompt must be text' })
  prompt: string;

  @ApiProperty({ example: '1,128', maxLength: 80 })
  @Trim()
  @Length(1, 80, { message: 'answer is missing (1 to 80 characters)' })
  @Matches(/^[^\r\n]*$/, { message: 'answer must be on one line' })
  @IsString({ message: 'answer must be text' })
  answer: string;

  @ApiPropertyOptional({ type: [String], example: ['partial products'] })
  @IfPresent()
  @Transform(trimList)
  @ArrayMaxSize(12, { message: 'skills can hold at most 12 entries' })
  @Length(1, 60, { each: true, message: 'each skill must be 1 to 60 characters' })
  @IsString({ each: true, message: 'each skill must be text' })
  @IsArray({ message: 'skills must be a list' })
  skills?: string[];

  @ApiPropertyOptional({
    type: [String],
    example: ['12', '31-33'],
    description: 'Lessons to revisit: lesson numbers and ranges such as 31-33',
  })
  @IfPresent()
  @Transform(numbersAsText)
  @ArrayMaxSize(20, { message: 'revisit can hold at most 20 entries' })
  @IsString({ each: true, message: 'each lesson to revisit must be a number or a range' })
  @IsArray({ message: 'revisit must be a list of lesson numbers or ranges' })
  revisit?: string[];

  @ApiPropertyOptional({ type: [String], example: ['sixes'], description: 'Fact families' })
  @IfPresent()
  @Transform(trimList)
  @ArrayMaxSize(6, { message: 'facts can hold at most 6 entries' })
  @Length(1, 40, { each: true, message: 'each fact family must be 1 to 40 characters' })
  @IsString({ each: true, message: 'each fact family must be text' })
  @IsArray({ message: 'facts must be a list' })
  facts?: string[];
}

/** An item in a PATCH: with the `id` of an existing item, or without one for a new item. */
export class KeyItemUpdateDto extends KeyItemDto {
  @ApiPropertyOptional({ example: 41 })
  @IfPresent()
  @IsInt({ message: 'id must be a whole number' })
  id?: number;
}
