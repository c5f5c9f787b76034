import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  IsBoolean,
  IsInt,
  IsPositive,
  IsString,
  Max,
  MaxLength,
  Min,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';
import { MultiLine } from '../../common/decorators/multi-line.decorator.js';

const notNull = (_: object, value: unknown) => value !== null && value !== undefined;

export class SittingConditionsDto {
  @ApiPropertyOptional({ nullable: true, description: 'Well rested? null when not noted' })
  @ValidateIf(notNull)
  @IsBoolean({ message: 'conditions.rested must be true, false or null' })
  rested?: boolean | null;

  @ApiPropertyOptional({ nullable: true, description: 'Soon after a meal? null when not noted' })
  @ValidateIf(notNull)
  @IsBoolean({ message: 'conditions.afterMeal must be true, false or null' })
  afterMeal?: boolean | null;

  @ApiPropertyOptional({ example: 'a bit distracted by the rain', maxLength: 300 })
  @ValidateIf(notNull)
  @Trim()
  @MultiLine()
  @MaxLength(300, { message: 'conditions.note must be at most 300 characters' })
  @IsString({ message: 'conditions.note must be text' })
  note?: string | null;
}

export class CreateSittingDto {
  @ApiProperty({ example: 1 })
  @IsPositive({ message: 'studentId must be a whole number' })
  @IsInt({ message: 'studentId must be a whole number' })
  studentId: number;

  @ApiProperty({ example: 3 })
  @IsPositive({ message: 'answerKeyId must be a whole number' })
  @IsInt({ message: 'answerKeyId must be a whole number' })
  answerKeyId: number;

  @ApiProperty({
    example: '2026-03-02T09:30',
    description: 'Local clock time the sitting started, YYYY-MM-DDTHH:mm, without a time zone',
  })
  @IsString({ message: 'startedAt must be a local date and time such as 2026-03-02T09:30' })
  startedAt: string;

  @ApiPropertyOptional({ example: 25, nullable: true, minimum: 1, maximum: 600 })
  @ValidateIf(notNull)
  @Min(1, { message: 'minutes must be 1 or more' })
  @Max(600, { message: 'minutes must be at most 600' })
  @IsInt({ message: 'minutes must be a whole number' })
  minutes?: number | null;

  @ApiPropertyOptional({ type: SittingConditionsDto })
  @IfPresent()
  @Type(() => SittingConditionsDto)
  @ValidateNested()
  conditions?: SittingConditionsDto;
}
