import { Body, Controller, Get, Post, Query, StreamableFile } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { CheckUpsService } from './check-ups.service.js';
import { AnswerCheckUpDto } from './dto/answer-check-up.dto.js';
import { CreateCheckUpDto } from './dto/create-check-up.dto.js';
import { ListCheckUpsQuery } from './dto/list-check-ups.query.js';

@ApiTags('check-ups')
@Controller('check-ups')
export class CheckUpsController {
  constructor(private readonly checkUps: CheckUpsService) {}

  @Get()
  findAll(@CurrentMember() member: MemberContext, @Query() query: ListCheckUpsQuery) {
    return this.checkUps.findAll(member, query);
  }

  /** Any member, a tutor included, may plan a check-up for a child they can see. */
  @Post()
  create(@CurrentMember() member: MemberContext, @Body() dto: CreateCheckUpDto) {
    return this.checkUps.create(member, dto);
  }

  @Get(':id')
  findOne(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.checkUps.findOne(member, id);
  }

  /** The child's answers, entered by a parent: stored as a sitting of the check-up's key. */
  @Roles(Role.owner, Role.parent)
  @Post(':id/answers')
  answer(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: AnswerCheckUpDto,
  ) {
    return this.checkUps.answer(member, id, dto);
  }

  @Get(':id/sheet.pdf')
  sheet(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.file(member, id, 'sheet');
  }

  @Get(':id/answers.pdf')
  answers(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.file(member, id, 'answers');
  }

  private async file(member: MemberContext, id: number, which: 'sheet' | 'answers') {
    const { filename, body } = await this.checkUps.pdf(member, id, which);
    return new StreamableFile(body, {
      type: 'application/pdf',
      disposition: `attachment; filename="${filename}"`,
    });
  }
}
