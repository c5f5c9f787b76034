import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  CAUSES,
  INTERVIEW_STAGES,
  MISS_STATUSES,
  type Cause,
  type InterviewStage,
  type MissStatus,
} from '@workback/core';
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

/** Most number sentences one word problem keeps, and the longest sentence. */
export const MAX_LINES = 20;
export const MAX_LINE_LENGTH = 120;

/**
 * A word problem's lines arrive as a list, JSON text of one (multipart), or one field per line
 * (multipart repeats the name); each is trimmed and blank lines are dropped, so `lines.2` is
 * the third sentence the parent wrote.
 */
const CleanLines = () =>
  Transform(({ value }: { value: unknown }) => {
    let list = value;
    if (typeof list === 'string') {
      const text = list.trim();
      if (text === '') return undefined;
      try {
        list = text.startsWith('[') ? (JSON.parse(text) as unknown) : [text];
      } catch {
        return value;
      }
    }
    if (!Array.isArray(list)) return list;
    return list.map((l) => (typeof l === 'string' ? l.trim() : l)).filter((l) => l !== '');
  });

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

  @ApiPropertyOptional({
    type: [String],
    maxItems: MAX_LINES,
    description: `A word problem's number sentences as the child wrote them, one per line (at most ${MAX_LINE_LENGTH} characters each); checked line by line`,
    example: ['4 x 15 = 60', '60 - 18 = 42'],
  })
  @CleanLines()
  @ValidateIf(present)
  @IsArray({ message: 'lines must be a list of number sentences such as ["4 x 15 = 60"]' })
  @ArrayMaxSize(MAX_LINES, { message: `lines may hold at most ${MAX_LINES} sentences` })
  @IsString({ each: true, message: 'each line must be text' })
  lines?: string[];

  /** Newman's stages (Newman 1977); White (2005) for the interview in practice. */
  @ApiPropertyOptional({
    enum: INTERVIEW_STAGES,
    description: 'Where the word problem went wrong, found by the five interview prompts',
  })
  @ValidateIf(present)
  @IsIn(INTERVIEW_STAGES, { message: `stage must be one of ${INTERVIEW_STAGES.join(', ')}` })
  stage?: InterviewStage;

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
