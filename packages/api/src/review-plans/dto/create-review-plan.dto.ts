import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  ArrayMaxSize,
  ArrayMinSize,
  ArrayUnique,
  IsArray,
  IsInt,
  IsPositive,
  Validate,
} from 'class-validator';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';
import { CalendarDate } from '../../misses/dto/calendar-date.validator.js';

export const MAX_PLAN_MISSES = 60;

export class CreateReviewPlanDto {
  @ApiProperty({ example: 1 })
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId: number;

  @ApiProperty({ example: '2026-03-12', description: 'The day of the review (YYYY-MM-DD)' })
  @Validate(CalendarDate, [{ allowFuture: true }])
  scheduledFor: string;

  @ApiPropertyOptional({
    type: [Number],
    description: 'The misses to review; default: the open misses not on the student’s last plan',
  })
  @IfPresent()
  @IsArray({ message: 'missIds must be a list of miss ids' })
  @ArrayMinSize(1, { message: 'missIds must name at least one miss (or leave it out)' })
  @ArrayMaxSize(MAX_PLAN_MISSES, { message: `missIds may name at most ${MAX_PLAN_MISSES} misses` })
  @ArrayUnique({ message: 'missIds must not name a miss twice' })
  @IsInt({ each: true, message: 'missIds must be whole numbers' })
  @IsPositive({ each: true, message: 'missIds must be whole numbers' })
  missIds?: number[];
}
