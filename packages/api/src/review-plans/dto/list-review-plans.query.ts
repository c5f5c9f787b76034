import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, IsOptional, IsPositive, Max, Min } from 'class-validator';

export class ListReviewPlansQuery {
  @ApiPropertyOptional()
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId?: number;

  @ApiPropertyOptional({ default: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'page must be a whole number from 1' })
  @Min(1, { message: 'page must be a whole number from 1' })
  page?: number;

  @ApiPropertyOptional({ default: 25, maximum: 100 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'pageSize must be a whole number from 1 to 100' })
  @Min(1, { message: 'pageSize must be a whole number from 1 to 100' })
  @Max(100, { message: 'pageSize must be a whole number from 1 to 100' })
  pageSize?: number;
}
