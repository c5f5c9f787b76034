import { ApiProperty } from '@nestjs/swagger';
import { GRADE_LEVELS } from '@workback/core';
import { IsIn, IsString, Length, Matches } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';

export class CreateStudentDto {
  @ApiProperty({ description: 'First name or nickname only', example: 'Juniper', maxLength: 40 })
  @Trim()
  @IsString()
  @Length(1, 40, { message: 'name must be 1 to 40 characters (a first name or nickname)' })
  @Matches(/\S/, { message: 'name must not be blank' })
  name: string;

  @ApiProperty({ enum: GRADE_LEVELS, example: '3' })
  @IsIn(GRADE_LEVELS, { message: `gradeLevel must be one of ${GRADE_LEVELS.join(', ')}` })
  gradeLevel: string;
}
