import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsInt, IsOptional, IsPositive } from 'class-validator';
import { WholeNumber } from '../../common/decorators/id-param.decorator.js';

export class ListCheckUpsQuery {
  @ApiPropertyOptional({ example: 1 })
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId?: number;
}
