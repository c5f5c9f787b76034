import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  ArrayMaxSize,
  ArrayMinSize,
  ArrayUnique,
  IsArray,
  IsInt,
  IsPositive,
  IsString,
  MaxLength,
} from 'class-validator';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { MultiLine } from '../../common/decorators/multi-line.decorator.js';

export class SendReviewPlanDto {
  @ApiProperty({ type: [Number], description: 'Household member ids (GET /members) to e-mail' })
  @IsArray({ message: 'memberIds must be a list of member ids' })
  @ArrayMinSize(1, { message: 'memberIds must name at least one member' })
  @ArrayMaxSize(10, { message: 'memberIds may name at most 10 members' })
  @ArrayUnique({ message: 'memberIds must not name a member twice' })
  @IsInt({ each: true, message: 'memberIds must be whole numbers' })
  @IsPositive({ each: true, message: 'memberIds must be whole numbers' })
  memberIds: number[];

  @ApiPropertyOptional({ example: 'For Thursday morning.', maxLength: 500 })
  @IfPresent()
  @Trim()
  @IsString({ message: 'message must be text' })
  @MultiLine()
  @MaxLength(500, { message: 'message must be at most 500 characters' })
  message?: string;
}
