import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsBoolean,
  IsInt,
  IsPositive,
  Validate,
  ValidateNested,
} from 'class-validator';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';
import { CalendarDate } from '../../misses/dto/calendar-date.validator.js';

export class PlanItemCheckDto {
  @ApiProperty({ example: 12 })
  @IsInt({ message: 'id must be a whole number' })
  @IsPositive({ message: 'id must be a whole number' })
  id: number;

  @ApiProperty({ example: true })
  @IsBoolean({ message: 'done must be true or false' })
  done: boolean;
}

export class UpdateReviewPlanDto {
  @ApiPropertyOptional({ example: '2026-03-13' })
  @IfPresent()
  @Validate(CalendarDate, [{ allowFuture: true }])
  scheduledFor?: string;

  @ApiPropertyOptional({ type: [PlanItemCheckDto], description: 'Items checked off (or not)' })
  @IfPresent()
  @IsArray({ message: 'items must be a list of { id, done }' })
  @ArrayMaxSize(500, { message: 'items may hold at most 500 entries' })
  @ValidateNested({ each: true })
  @Type(() => PlanItemCheckDto)
  items?: PlanItemCheckDto[];
}
