import { Body, Controller, Get, Post, Query } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { CreateNoteDto } from './dto/create-note.dto.js';
import { ListNotesQuery } from './dto/list-notes.query.js';
import { NotesService } from './notes.service.js';

/** Parents and granted tutors alike write notes on the misses they can see. */
@ApiTags('notes')
@Controller('notes')
export class NotesController {
  constructor(private readonly notes: NotesService) {}

  @Get()
  findAll(@CurrentMember() member: MemberContext, @Query() query: ListNotesQuery) {
    return this.notes.findAll(member, query);
  }

  @Post()
  create(@CurrentMember() member: MemberContext, @Body() dto: CreateNoteDto) {
    return this.notes.create(member, dto);
  }
}
