import { ApiPropertyOptional } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { ArrayMaxSize, IsArray, IsIn, IsInt, IsOptional, Min } from 'class-validator';

export class UpdateMemberDto {
  @ApiPropertyOptional({ enum: [Role.owner, Role.parent, Role.tutor] })
  @IsOptional()
  @IsIn([Role.owner, Role.parent, Role.tutor], { message: 'role must be owner, parent or tutor' })
  role?: Role;

  @ApiPropertyOptional({ type: [Number], description: 'A tutor’s granted students (at least one)' })
  @IsOptional()
  @IsArray({ message: 'studentIds must be a list of student ids' })
  @ArrayMaxSize(200)
  @IsInt({ each: true, message: 'studentIds must be a list of student ids' })
  @Min(1, { each: true, message: 'studentIds must be a list of student ids' })
  studentIds?: number[];
}
