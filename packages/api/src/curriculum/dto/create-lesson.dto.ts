import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsInt, IsString, Length, Matches, Max, Min } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';

export const trimList = ({ value }: { value: unknown }) =>
  Array.isArray(value) ? value.map((v) => (typeof v === 'string' ? v.trim() : v)) : value;

export class CreateLessonDto {
  @ApiProperty({ example: 12, minimum: 1, maximum: 9999 })
  @Min(1, { message: 'number must be 1 or more' })
  @Max(9999, { message: 'number must be at most 9999' })
  @IsInt({ message: 'number must be a whole number' })
  number: number;

  @ApiProperty({ example: 'Subtracting across zeros', maxLength: 120 })
  @Trim()
  @Length(1, 120, { message: 'title must be 1 to 120 characters' })
  @Matches(/\S/, { message: 'title must not be blank' })
  @IsString()
  title: string;

  @ApiPropertyOptional({ type: [String], example: ['regrouping', 'subtraction'] })
  @IfPresent()
  @Transform(trimList)
  @ArrayMaxSize(12, { message: 'skills can hold at most 12 entries' })
  @Length(1, 60, { each: true, message: 'each skill must be 1 to 60 characters' })
  @IsString({ each: true, message: 'each skill must be text' })
  @IsArray({ message: 'skills must be a list of words' })
  skills?: string[];
}
