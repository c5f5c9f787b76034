import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, Length, Matches } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';

export class CreateCourseDto {
  @ApiProperty({ example: 'Number Paths, level 4', maxLength: 80 })
  @Trim()
  @Length(1, 80, { message: 'name must be 1 to 80 characters' })
  @Matches(/\S/, { message: 'name must not be blank' })
  @IsString()
  name: string;

  @ApiPropertyOptional({ example: 'Level 4', maxLength: 40, nullable: true })
  @IsOptional()
  @Trim()
  @Length(0, 40, { message: 'level must be at most 40 characters' })
  @IsString()
  level?: string | null;
}
