import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsInt, IsOptional, IsPositive, Validate } from 'class-validator';
import { CalendarDate } from '../../misses/dto/calendar-date.validator.js';
import { WholeNumber } from '../../common/decorators/id-param.decorator.js';

export class PatternsQuery {
  @ApiProperty({ example: 1 })
  @WholeNumber()
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId: number;

  @ApiPropertyOptional({ example: '2026-03-01', description: 'From this day (inclusive)' })
  @IsOptional()
  @Validate(CalendarDate, [{ allowFuture: true }])
  from?: string;

  @ApiPropertyOptional({ example: '2026-04-30', description: 'To this day (inclusive)' })
  @IsOptional()
  @Validate(CalendarDate, [{ allowFuture: true }])
  to?: string;
}

export class PatternNotesQuery {
  @ApiProperty({ example: 1 })
  @WholeNumber()
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId: number;
}
