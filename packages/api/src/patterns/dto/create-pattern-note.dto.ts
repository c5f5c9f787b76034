import { ApiProperty } from '@nestjs/swagger';
import { IsInt, IsPositive, IsString, Length, Matches } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { MultiLine } from '../../common/decorators/multi-line.decorator.js';

export class CreatePatternNoteDto {
  @ApiProperty({ example: 1 })
  @IsInt({ message: 'studentId must be a whole number' })
  @IsPositive({ message: 'studentId must be a whole number' })
  studentId: number;

  @ApiProperty({
    example: 'rule:sub.borrow-across-zero',
    description: 'A pattern key as GET /patterns gives it: rule:…, fact:…, skill:… or group:…',
  })
  @IsString({ message: 'patternKey must be text such as rule:sub.borrow-across-zero' })
  @Length(3, 120, { message: 'patternKey must be 3 to 120 characters' })
  patternKey: string;

  @ApiProperty({
    example: 'Worked 3 zero problems with base-ten blocks; steadier.',
    maxLength: 2000,
  })
  @Trim()
  @IsString()
  @MultiLine()
  @Length(1, 2000, { message: 'body must be 1 to 2000 characters' })
  @Matches(/\S/, { message: 'body must not be blank' })
  body: string;
}
