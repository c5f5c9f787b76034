import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsNumber,
  IsString,
  Max,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';

export const MAX_MARKS = 20;

export class MarkDto {
  @ApiProperty({
    description: 'From the left edge, as a fraction of the width (0 to 1)',
    example: 0.42,
  })
  @IsNumber(
    { allowNaN: false, allowInfinity: false },
    { message: 'x must be a number from 0 to 1' },
  )
  @Min(0, { message: 'x must be a number from 0 to 1' })
  @Max(1, { message: 'x must be a number from 0 to 1' })
  x: number;

  @ApiProperty({
    description: 'From the top edge, as a fraction of the height (0 to 1)',
    example: 0.3,
  })
  @IsNumber(
    { allowNaN: false, allowInfinity: false },
    { message: 'y must be a number from 0 to 1' },
  )
  @Min(0, { message: 'y must be a number from 0 to 1' })
  @Max(1, { message: 'y must be a number from 0 to 1' })
  y: number;

  @ApiPropertyOptional({ maxLength: 40, example: 'borrowed here' })
  @IfPresent()
  @Trim()
  @IsString()
  @MaxLength(40, { message: 'label must be at most 40 characters' })
  label?: string;
}

export class SetMarksDto {
  @ApiProperty({
    type: [MarkDto],
    description: 'The whole set of pins; it replaces the previous one',
  })
  @IsArray({ message: 'marks must be a list of { x, y, label? }' })
  @ArrayMaxSize(MAX_MARKS, { message: `a photo may carry at most ${MAX_MARKS} pins` })
  @ValidateNested({ each: true })
  @Type(() => MarkDto)
  marks: MarkDto[];
}
