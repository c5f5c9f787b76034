import { Body, Controller, Delete, Get, HttpCode, Post, Query } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { CreatePatternNoteDto } from './dto/create-pattern-note.dto.js';
import { PatternNotesQuery, PatternsQuery } from './dto/patterns.query.js';
import { PatternsService } from './patterns.service.js';

/** Parents and granted tutors read patterns and note on them; only parents delete notes. */
@ApiTags('patterns')
@Controller('patterns')
export class PatternsController {
  constructor(private readonly patterns: PatternsService) {}

  @Get()
  find(@CurrentMember() member: MemberContext, @Query() query: PatternsQuery) {
    return this.patterns.find(member, query);
  }

  @Get('notes')
  listNotes(@CurrentMember() member: MemberContext, @Query() query: PatternNotesQuery) {
    return this.patterns.listNotes(member, query.studentId);
  }

  @Post('notes')
  createNote(@CurrentMember() member: MemberContext, @Body() dto: CreatePatternNoteDto) {
    return this.patterns.createNote(member, dto);
  }

  @Roles(Role.owner, Role.parent)
  @Delete('notes/:id')
  @HttpCode(204)
  async removeNote(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    await this.patterns.removeNote(member, id);
  }
}
