import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { RULES } from '@workback/core';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsIn,
  IsInt,
  IsPositive,
  Max,
  Min,
} from 'class-validator';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';

const RULE_IDS = RULES.map((r) => r.id);

export class CreateCheckUpDto {
  @ApiProperty({ example: 1 })
  @IsPositive({ message: 'studentId must be a whole number' })
  @IsInt({ message: 'studentId must be a whole number' })
  studentId: number;

  @ApiProperty({
    example: ['sub.borrow-across-zero', 'sub.borrow-from-zero'],
    description: 'The error rules to tell apart from each other and from the right working',
  })
  @IsIn(RULE_IDS, { each: true, message: 'ruleIds must hold rule ids from the catalog' })
  @ArrayMaxSize(4, { message: 'ruleIds can hold at most 4 rules' })
  @ArrayMinSize(1, { message: 'ruleIds needs at least one rule' })
  @IsArray({ message: 'ruleIds must be a list of rule ids' })
  ruleIds: string[];

  @ApiPropertyOptional({
    example: 3,
    minimum: 1,
    maximum: 6,
    description: 'Digits in the problems, like those of the misses (default 3)',
  })
  @IfPresent()
  @Min(1, { message: 'digits must be 1 or more' })
  @Max(6, { message: 'digits must be at most 6' })
  @IsInt({ message: 'digits must be a whole number' })
  digits?: number;
}
