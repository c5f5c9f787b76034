import { Body, Controller, Delete, Get, HttpCode, Patch, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { CurriculumService } from './curriculum.service.js';
import { CreateCourseDto } from './dto/create-course.dto.js';
import { CreateLessonDto } from './dto/create-lesson.dto.js';
import { UpdateCourseDto } from './dto/update-course.dto.js';
import { UpdateLessonDto } from './dto/update-lesson.dto.js';

@ApiTags('curriculum')
@Controller()
export class CurriculumController {
  constructor(private readonly curriculum: CurriculumService) {}

  @Get('courses')
  findAll(@CurrentMember() member: MemberContext) {
    return this.curriculum.findAll(member);
  }

  @Roles(Role.owner, Role.parent)
  @Post('courses')
  create(@CurrentMember() member: MemberContext, @Body() dto: CreateCourseDto) {
    return this.curriculum.create(member, dto);
  }

  @Get('courses/:id')
  findOne(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.curriculum.findOne(member, id);
  }

  @Roles(Role.owner, Role.parent)
  @Patch('courses/:id')
  update(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: UpdateCourseDto,
  ) {
    return this.curriculum.update(member, id, dto);
  }

  @Roles(Role.owner, Role.parent)
  @Delete('courses/:id')
  @HttpCode(204)
  remove(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.curriculum.remove(member, id);
  }

  @Get('courses/:id/lessons')
  findLessons(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.curriculum.findLessons(member, id);
  }

  @Roles(Role.owner, Role.parent)
  @Post('courses/:id/lessons')
  createLesson(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: CreateLessonDto,
  ) {
    return this.curriculum.createLesson(member, id, dto);
  }

  @Roles(Role.owner, Role.parent)
  @Patch('lessons/:id')
  updateLesson(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: UpdateLessonDto,
  ) {
    return this.curriculum.updateLesson(member, id, dto);
  }

  @Roles(Role.owner, Role.parent)
  @Delete('lessons/:id')
  @HttpCode(204)
  removeLesson(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.curriculum.removeLesson(member, id);
  }
}
