import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsInt, IsOptional, IsPositive } from 'class-validator';
import { PageQuery } from '../../common/dto/page.query.js';
import { WholeNumber } from '../../common/decorators/id-param.decorator.js';

export class ListNotesQuery extends PageQuery {
  @ApiPropertyOptional({ description: 'The notes of one miss, oldest first' })
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'missId must be a whole number' })
  @IsPositive({ message: 'missId must be a whole number' })
  missId?: number;

  // Only the documented default differs (the service pages notes by 50); PageQuery's checks apply.
  @ApiPropertyOptional({ default: 50, maximum: 100 })
  override pageSize?: number;
}
