import { ApiProperty } from '@nestjs/swagger';
import { IsInt, IsPositive, IsString, Length, Matches } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { MultiLine } from '../../common/decorators/multi-line.decorator.js';

export class CreateNoteDto {
  @ApiProperty({ example: 12 })
  @IsInt({ message: 'missId must be a whole number' })
  @IsPositive({ message: 'missId must be a whole number' })
  missId: number;

  @ApiProperty({ example: 'Same borrow-across-zero step as last week.', maxLength: 2000 })
  @Trim()
  @IsString()
  @MultiLine()
  @Length(1, 2000, { message: 'body must be 1 to 2000 characters' })
  @Matches(/\S/, { message: 'body must not be blank' })
  body: string;
}
