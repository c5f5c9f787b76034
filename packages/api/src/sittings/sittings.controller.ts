import { Body, Controller, Get, Post, Put, Query } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { CreateSittingDto } from './dto/create-sitting.dto.js';
import { ListSittingsQuery, SittingRangeQuery } from './dto/list-sittings.query.js';
import { PutMarksDto } from './dto/put-marks.dto.js';
import { SittingMarksService } from './sitting-marks.service.js';
import { SittingSummariesService } from './sitting-summaries.service.js';
import { SittingsService } from './sittings.service.js';

@ApiTags('sittings')
@Controller()
export class SittingsController {
  constructor(
    private readonly sittings: SittingsService,
    private readonly marks: SittingMarksService,
    private readonly summaries: SittingSummariesService,
  ) {}

  @Get('sittings')
  findAll(@CurrentMember() member: MemberContext, @Query() query: ListSittingsQuery) {
    return this.sittings.findAll(member, query);
  }

  @Roles(Role.owner, Role.parent)
  @Post('sittings')
  create(@CurrentMember() member: MemberContext, @Body() dto: CreateSittingDto) {
    return this.sittings.create(member, dto);
  }

  @Get('sittings/:id')
  findOne(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.sittings.findOne(member, id);
  }

  @Roles(Role.owner, Role.parent)
  @Put('sittings/:id/marks')
  putMarks(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: PutMarksDto,
  ) {
    return this.marks.putMarks(member, id, dto);
  }

  @Get('students/:id/sittings/summary')
  summary(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Query() query: SittingRangeQuery,
  ) {
    return this.summaries.summary(member, id, query);
  }
}
