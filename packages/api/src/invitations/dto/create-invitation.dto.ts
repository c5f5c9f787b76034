import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { ArrayMaxSize, IsArray, IsEmail, IsIn, IsInt, Length, Min } from 'class-validator';
import { Trim } from '../../common/decorators/trim.decorator.js';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';

export class CreateInvitationDto {
  @ApiProperty({ example: 'helper@example.test' })
  @Trim()
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @Length(3, 254, { message: 'email must be an e-mail address' })
  email: string;

  @ApiProperty({ enum: [Role.parent, Role.tutor] })
  @IsIn([Role.parent, Role.tutor], { message: 'role must be parent or tutor' })
  role: Role;

  @ApiPropertyOptional({
    type: [Number],
    description: 'For a tutor: the students they may see (at least one). Not for a parent.',
  })
  @IfPresent()
  @IsArray({ message: 'studentIds must be a list of student ids' })
  @ArrayMaxSize(200)
  @IsInt({ each: true, message: 'studentIds must be a list of student ids' })
  @Min(1, { each: true, message: 'studentIds must be a list of student ids' })
  studentIds?: number[];
}
