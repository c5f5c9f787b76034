import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, IsOptional, Max, Min } from 'class-validator';

/** `?page=2&pageSize=25` for a paged list; a list extends it with its own filters. */
export class PageQuery {
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
