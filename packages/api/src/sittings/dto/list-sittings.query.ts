import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsInt, IsOptional, IsPositive, Max, Min, Validate } from 'class-validator';
import { CalendarDate } from '../../misses/dto/calendar-date.validator.js';
import { WholeNumber } from '../../common/decorators/id-param.decorator.js';

export const SITTING_SORTS = ['startedAt', '-startedAt'] as const;

export class SittingRangeQuery {
  @ApiPropertyOptional({ example: '2026-03-01', description: 'From this day (inclusive)' })
  @IsOptional()
  @Validate(CalendarDate, [{ allowFuture: true }])
  from?: string;

  @ApiPropertyOptional({ example: '2026-03-31', description: 'To this day (inclusive)' })
  @IsOptional()
  @Validate(CalendarDate, [{ allowFuture: true }])
  to?: string;
}

export class ListSittingsQuery extends SittingRangeQuery {
  @ApiPropertyOptional()
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId?: number;

  @ApiPropertyOptional()
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'answerKeyId must be a whole number' })
  @IsPositive({ message: 'answerKeyId must be a whole number' })
  answerKeyId?: number;

  @ApiPropertyOptional({ default: 1 })
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'page must be a whole number' })
  @Min(1, { message: 'page must be 1 or more' })
  page?: number;

  @ApiPropertyOptional({ default: 50, maximum: 100 })
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'pageSize must be a whole number' })
  @Min(1, { message: 'pageSize must be 1 to 100' })
  @Max(100, { message: 'pageSize must be 1 to 100' })
  pageSize?: number;

  @ApiPropertyOptional({ enum: SITTING_SORTS, default: '-startedAt' })
  @IsOptional()
  @IsIn(SITTING_SORTS, { message: `sort must be one of ${SITTING_SORTS.join(', ')}` })
  sort?: (typeof SITTING_SORTS)[number];
}
