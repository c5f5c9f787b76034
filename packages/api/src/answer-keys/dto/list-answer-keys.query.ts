import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsInt, IsOptional, Min } from 'class-validator';
import { KEY_KINDS, type KeyKind } from '../models/answer-key.model.js';
import { WholeNumber } from '../../common/decorators/id-param.decorator.js';

export class ListAnswerKeysQuery {
  @ApiPropertyOptional()
  @IsOptional()
  @WholeNumber()
  @IsInt({ message: 'courseId must be a whole number' })
  @Min(1, { message: 'courseId must be a whole number' })
  courseId?: number;

  @ApiPropertyOptional({ enum: KEY_KINDS })
  @IsOptional()
  @IsIn(KEY_KINDS, { message: `kind must be one of ${KEY_KINDS.join(', ')}` })
  kind?: KeyKind;
}
