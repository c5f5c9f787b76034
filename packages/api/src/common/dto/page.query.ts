import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsInt, IsOptional, Max, Min } from 'class-validator';
import { WholeNumber } from '../decorators/id-param.decorator.js';

/** `?page=2&pageSize=25` for a paged list; a list extends it with its own filters. */
export class PageQuery {
  @ApiPropertyOptional({ default: 1 })
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'page must be a whole number from 1' })
  @Min(1, { message: 'page must be a whole number from 1' })
  page?: number;

  @ApiPropertyOptional({ default: 25, maximum: 100 })
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'pageSize must be a whole number from 1 to 100' })
  @Min(1, { message: 'pageSize must be a whole number from 1 to 100' })
  @Max(100, { message: 'pageSize must be a whole number from 1 to 100' })
  pageSize?: number;
}
