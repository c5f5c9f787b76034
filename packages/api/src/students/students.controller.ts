import { Body, Controller, Delete, Get, HttpCode, Patch, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { CreateStudentDto } from './dto/create-student.dto.js';
import { UpdateStudentDto } from './dto/update-student.dto.js';
import { StudentsService } from './students.service.js';

@ApiTags('students')
@Controller('students')
export class StudentsController {
  constructor(private readonly students: StudentsService) {}

  @Get()
  findAll(@CurrentMember() member: MemberContext) {
    return this.students.findAll(member);
  }

  @Roles(Role.owner, Role.parent)
  @Post()
  create(@CurrentMember() member: MemberContext, @Body() dto: CreateStudentDto) {
    return this.students.create(member, dto);
  }

  @Get(':id')
  findOne(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.students.findOne(member, id);
  }

  @Roles(Role.owner, Role.parent)
  @Patch(':id')
  update(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: UpdateStudentDto,
  ) {
    return this.students.update(member, id, dto);
  }

  @Roles(Role.owner, Role.parent)
  @Delete(':id')
  @HttpCode(204)
  remove(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.students.remove(member, id);
  }
}
