import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { CAUSES, type Cause } from '@workback/core';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsBoolean,
  IsIn,
  IsInt,
  IsPositive,
  IsString,
  MaxLength,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';
import { Trim } from '../../common/decorators/trim.decorator.js';

export class MarkDto {
  @ApiProperty({ example: 41 })
  @IsPositive({ message: 'keyItemId must be a whole number' })
  @IsInt({ message: 'keyItemId must be a whole number' })
  keyItemId: number;

  @ApiProperty({ example: false })
  @IsBoolean({ message: 'correct must be true or false' })
  correct: boolean;

  @ApiPropertyOptional({
    example: '1,138',
    nullable: true,
    description: 'The child’s answer as written (wanted for wrong items)',
  })
  @ValidateIf((_, v) => v !== null && v !== undefined)
  @Trim()
  @MaxLength(80, { message: 'answer must be at most 80 characters' })
  @IsString({ message: 'answer must be text' })
  answer?: string | null;

  @ApiPropertyOptional({
    enum: CAUSES,
    description: 'For a wrong item: the cause, when the parent already knows it (default unsure)',
  })
  @ValidateIf((_, v) => v !== null && v !== undefined)
  @IsIn(CAUSES, { message: `cause must be one of ${CAUSES.join(', ')}` })
  cause?: Cause | null;

  @ApiPropertyOptional({
    example: true,
    description:
      'When the checker flags the key’s answer to this item: true says the key’s answer is right, so a wrong mark makes a miss now (without it, no miss is made until the key is checked)',
  })
  @IfPresent()
  @IsBoolean({ message: 'keyAnswerRight must be true or false' })
  keyAnswerRight?: boolean;
}

export class PutMarksDto {
  @ApiProperty({ type: [MarkDto], description: 'Every marked item; items left out are unmarked' })
  @Type(() => MarkDto)
  @ArrayMaxSize(300, { message: 'marks can hold at most 300 items' })
  @ValidateNested({ each: true })
  @IsArray({ message: 'marks must be a list' })
  marks: MarkDto[];
}
