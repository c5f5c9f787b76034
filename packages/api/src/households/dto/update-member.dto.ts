import { ApiPropertyOptional } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { ArrayMaxSize, IsArray, IsIn, IsInt, Min } from 'class-validator';
import { IfPresent } from '../../common/decorators/if-present.decorator.js';

export class UpdateMemberDto {
  @ApiPropertyOptional({ enum: [Role.owner, Role.parent, Role.tutor] })
  @IfPresent()
  @IsIn([Role.owner, Role.parent, Role.tutor], { message: 'role must be owner, parent or tutor' })
  role?: Role;

  @ApiPropertyOptional({ type: [Number], description: 'A tutor’s granted students (at least one)' })
  @IfPresent()
  @IsArray({ message: 'studentIds must be a list of student ids' })
  @ArrayMaxSize(200)
  @IsInt({ each: true, message: 'studentIds must be a list of student ids' })
  @Min(1, { each: true, message: 'studentIds must be a list of student ids' })
  studentIds?: number[];
}
