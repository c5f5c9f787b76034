import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { CAUSES, MISS_STATUSES, type Cause, type MissStatus } from '@workback/core';
import { Transform } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsIn,
  IsInt,
  IsObject,
  IsOptional,
  IsPositive,
  IsString,
  Length,
  Matches,
  MaxLength,
  Validate,
  ValidateIf,
} from 'class-validator';
import type { WrittenSteps } from '@workback/core';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { CalendarDate } from './calendar-date.validator.js';
import { MultiLine } from '../../common/decorators/multi-line.decorator.js';
import { WholeNumber } from '../../common/decorators/id-param.decorator.js';

/** Multipart fields arrive as text: a JSON field is parsed, and left as text for the validator to refuse when it is not JSON. */
export const ParseJsonField = () =>
  Transform(({ value }: { value: unknown }) => {
    if (typeof value !== 'string') return value;
    if (value.trim() === '') return undefined;
    try {
      return JSON.parse(value) as unknown;
    } catch {
      return value;
    }
  });

const present = (_: object, value: unknown) => value !== undefined;

export class CreateMissDto {
  @ApiProperty({ example: 1 })
  @WholeNumber()
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId: number;

  @ApiProperty({ example: '2026-03-14', description: 'The day of the worksheet (YYYY-MM-DD)' })
  @IsString()
  @Validate(CalendarDate)
  occurredOn: string;

  @ApiProperty({ example: '304 - 75', maxLength: 200 })
  @Trim()
  @IsString()
  @Length(1, 200, { message: 'problem must be 1 to 200 characters' })
  problem: string;

  @ApiProperty({ example: '139', maxLength: 80, description: 'The child’s answer as written' })
  @Trim()
  @IsString()
  @Length(1, 80, { message: 'answer must be 1 to 80 characters' })
  answer: string;

  @ApiPropertyOptional({
    description: 'Written steps as JSON: { "partials": ["68","340"] } or { "lines": [...] }',
    example: { partials: ['68', '340'] },
  })
  @ParseJsonField()
  @IsOptional()
  @IsObject({ message: 'steps must be JSON such as { "partials": ["68", "340"] }' })
  steps?: WrittenSteps | null;

  @ApiPropertyOptional({ description: 'The child’s own words, kept as written', maxLength: 2000 })
  @ValidateIf(present)
  @IsString()
  @MultiLine()
  @MaxLength(2000, { message: 'explanation must be at most 2000 characters' })
  explanation?: string;

  @ApiPropertyOptional({ enum: CAUSES, default: 'unsure' })
  @ValidateIf(present)
  @IsIn(CAUSES, { message: `cause must be one of ${CAUSES.join(', ')}` })
  cause?: Cause;

  @ApiPropertyOptional({ description: 'The parent’s note', maxLength: 2000 })
  @ValidateIf(present)
  @IsString()
  @MultiLine()
  @MaxLength(2000, { message: 'note must be at most 2000 characters' })
  note?: string;

  @ApiPropertyOptional({ enum: MISS_STATUSES, default: 'logged' })
  @ValidateIf(present)
  @IsIn(MISS_STATUSES, { message: `status must be one of ${MISS_STATUSES.join(', ')}` })
  status?: MissStatus;

  @ApiPropertyOptional({ type: [String], example: ['subtraction.regrouping'] })
  @ParseJsonField()
  @ValidateIf(present)
  @IsArray({ message: 'skills must be a list such as ["subtraction.regrouping"]' })
  @ArrayMaxSize(20, { message: 'skills may list at most 20 skills' })
  @IsString({ each: true, message: 'each skill must be text' })
  @Length(1, 40, { each: true, message: 'each skill must be 1 to 40 characters' })
  @Matches(/\S/, { each: true, message: 'a skill must not be blank' })
  skills?: string[];

  @ApiPropertyOptional({ type: [String], description: 'Lessons to revisit', example: ['12'] })
  @ParseJsonField()
  @ValidateIf(present)
  @IsArray({ message: 'revisit must be a list such as ["12", "14"]' })
  @ArrayMaxSize(20, { message: 'revisit may list at most 20 lessons' })
  @IsString({ each: true, message: 'each lesson to revisit must be text' })
  @Length(1, 40, { each: true, message: 'each lesson to revisit must be 1 to 40 characters' })
  revisit?: string[];
}
