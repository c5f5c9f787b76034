import { ApiPropertyOptional } from '@nestjs/swagger';
import {
  CAUSES,
  INTERVIEW_STAGES,
  MISS_KINDS,
  MISS_STATUSES,
  type Cause,
  type InterviewStage,
  type MissKind,
  type MissStatus,
} from '@workback/core';
import {
  IsIn,
  IsInt,
  IsOptional,
  IsPositive,
  IsString,
  MaxLength,
  Validate,
} from 'class-validator';
import { PageQuery } from '../../common/dto/page.query.js';
import { CalendarDate } from './calendar-date.validator.js';
import { WholeNumber } from '../../common/decorators/id-param.decorator.js';

export const MISS_SORTS = [
  'occurredOn',
  'createdAt',
  'updatedAt',
  'status',
  'cause',
  'problem',
] as const;
const SORT_VALUES = MISS_SORTS.flatMap((s) => [s, `-${s}`]);

export class ListMissesQuery extends PageQuery {
  @ApiPropertyOptional()
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId?: number;

  @ApiPropertyOptional({ enum: CAUSES })
  @IsOptional()
  @IsIn(CAUSES, { message: `cause must be one of ${CAUSES.join(', ')}` })
  cause?: Cause;

  @ApiPropertyOptional({ enum: MISS_STATUSES })
  @IsOptional()
  @IsIn(MISS_STATUSES, { message: `status must be one of ${MISS_STATUSES.join(', ')}` })
  status?: MissStatus;

  @ApiPropertyOptional({
    enum: MISS_KINDS,
    description:
      'The kind of problem: whole numbers, fractions, decimals, money, clock times, a word problem, or other',
  })
  @IsOptional()
  @IsIn(MISS_KINDS, { message: `kind must be one of ${MISS_KINDS.join(', ')}` })
  kind?: MissKind;

  @ApiPropertyOptional({
    enum: INTERVIEW_STAGES,
    description: 'Word problems that went wrong at this interview stage',
  })
  @IsOptional()
  @IsIn(INTERVIEW_STAGES, { message: `stage must be one of ${INTERVIEW_STAGES.join(', ')}` })
  stage?: InterviewStage;

  @ApiPropertyOptional({
    example: 'sub.borrow-across-zero',
    description: 'A step-error rule, or a family of related rules (group:zero-regrouping)',
  })
  @IsOptional()
  @IsString()
  @MaxLength(80)
  rule?: string;

  @ApiPropertyOptional({ example: 'subtraction.regrouping' })
  @IsOptional()
  @IsString()
  @MaxLength(40)
  skill?: string;

  @ApiPropertyOptional({ example: '2026-03-01', description: 'From this day (inclusive)' })
  @IsOptional()
  @Validate(CalendarDate, [{ allowFuture: true }])
  from?: string;

  @ApiPropertyOptional({ example: '2026-03-31', description: 'To this day (inclusive)' })
  @IsOptional()
  @Validate(CalendarDate, [{ allowFuture: true }])
  to?: string;

  @ApiPropertyOptional({ description: 'Words in the problem or the explanation' })
  @IsOptional()
  @IsString()
  @MaxLength(100, { message: 'q must be at most 100 characters' })
  q?: string;

  @ApiPropertyOptional({ enum: SORT_VALUES, default: '-occurredOn' })
  @IsOptional()
  @IsIn(SORT_VALUES, { message: `sort must be one of ${SORT_VALUES.join(', ')}` })
  sort?: string;
}
