import { ApiPropertyOptional, OmitType, PartialType } from '@nestjs/swagger';
import { INTERVIEW_STAGES, type InterviewStage } from '@workback/core';
import { IsIn, IsOptional } from 'class-validator';
import { CreateMissDto } from './create-miss.dto.js';

/**
 * Every field optional; `null` is refused except for `steps` (which clears them) and `stage`
 * (the interview stage taken back). `lines: []` clears the number sentences.
 */
export class UpdateMissDto extends PartialType(OmitType(CreateMissDto, ['stage'] as const), {
  skipNullProperties: false,
}) {
  @ApiPropertyOptional({
    enum: INTERVIEW_STAGES,
    nullable: true,
    description: 'Where the word problem went wrong; null takes the stage back',
  })
  @IsOptional()
  @IsIn(INTERVIEW_STAGES, { message: `stage must be one of ${INTERVIEW_STAGES.join(', ')}` })
  stage?: InterviewStage | null;
}
