import { ApiProperty } from '@nestjs/swagger';
import { ArrayMaxSize, IsArray, IsString, MaxLength, ValidateIf } from 'class-validator';
import { CreateSittingDto } from '../../sittings/dto/create-sitting.dto.js';
import { OmitType } from '@nestjs/swagger';

/** When and how the check-up was taken (as for any sitting), and what the child wrote. */
export class AnswerCheckUpDto extends OmitType(CreateSittingDto, [
  'studentId',
  'answerKeyId',
] as const) {
  @ApiProperty({
    example: ['4535', '1674', null, '3769'],
    description: 'The child’s answer to each problem in order; null or empty when left blank',
  })
  @ValidateIf((_, v) => v !== null)
  @MaxLength(80, { each: true, message: 'each answer must be at most 80 characters' })
  @IsString({ each: true, message: 'each answer must be text or null' })
  @ArrayMaxSize(6, { message: 'answers can hold at most 6 answers' })
  @IsArray({ message: 'answers must be a list' })
  answers: (string | null)[];
}
