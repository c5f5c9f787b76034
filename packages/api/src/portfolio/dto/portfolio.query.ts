import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, Validate } from 'class-validator';
import { CalendarDate } from '../../misses/dto/calendar-date.validator.js';

export class PortfolioQuery {
  @ApiPropertyOptional({ example: '2026-01-01', description: 'From this day (inclusive)' })
  @IsOptional()
  @Validate(CalendarDate, [{ allowFuture: true }])
  from?: string;

  @ApiPropertyOptional({ example: '2026-06-30', description: 'To this day (inclusive)' })
  @IsOptional()
  @Validate(CalendarDate, [{ allowFuture: true }])
  to?: string;
}
