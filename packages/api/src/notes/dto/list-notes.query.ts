import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, IsOptional, IsPositive, Max, Min } from 'class-validator';

export class ListNotesQuery {
  @ApiPropertyOptional({ description: 'The notes of one miss, oldest first' })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'missId must be a whole number' })
  @IsPositive({ message: 'missId must be a whole number' })
  missId?: number;

  @ApiPropertyOptional({ default: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'page must be a whole number from 1' })
  @Min(1, { message: 'page must be a whole number from 1' })
  page?: number;

  @ApiPropertyOptional({ default: 50, maximum: 100 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'pageSize must be a whole number from 1 to 100' })
  @Min(1, { message: 'pageSize must be a whole number from 1 to 100' })
  @Max(100, { message: 'pageSize must be a whole number from 1 to 100' })
  pageSize?: number;
}
