import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsInt, IsOptional, IsPositive } from 'class-validator';
import { PageQuery } from '../../common/dto/page.query.js';
import { WholeNumber } from '../../common/decorators/id-param.decorator.js';

export class ListReviewPlansQuery extends PageQuery {
  @ApiPropertyOptional()
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId?: number;
}
