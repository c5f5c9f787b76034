import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsObject, IsString, Length } from 'class-validator';
import type { WrittenSteps } from '@workback/core';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';

export class DiagnoseDto {
  @ApiProperty({ example: '304 - 75', maxLength: 200 })
  @IsString()
  @Length(1, 200, { message: 'problem must be 1 to 200 characters' })
  problem: string;

  @ApiProperty({ example: '139', maxLength: 80 })
  @IsString()
  @Length(1, 80, { message: 'answer must be 1 to 80 characters' })
  answer: string;

  @ApiPropertyOptional({
    description: 'The written steps: { partials?: string[], lines?: string[] }',
    example: { partials: ['68', '340'] },
  })
  @IfPresent()
  @IsObject({ message: 'steps must be an object such as { "partials": ["68", "340"] }' })
  steps?: WrittenSteps;
}
