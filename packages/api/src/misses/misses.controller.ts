import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Patch,
  Post,
  Query,
  UploadedFiles,
} from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { PhotoUpload } from '../photos/photo-upload.js';
import { CreateMissDto } from './dto/create-miss.dto.js';
import { ListMissesQuery } from './dto/list-misses.query.js';
import { UpdateMissDto } from './dto/update-miss.dto.js';
import { MissesService } from './misses.service.js';

@ApiTags('misses')
@Controller('misses')
export class MissesController {
  constructor(private readonly misses: MissesService) {}

  @Get()
  findAll(@CurrentMember() member: MemberContext, @Query() query: ListMissesQuery) {
    return this.misses.findAll(member, query);
  }

  @Roles(Role.owner, Role.parent)
  @Post()
  @PhotoUpload()
  create(
    @CurrentMember() member: MemberContext,
    @Body() dto: CreateMissDto,
    @UploadedFiles() files: Express.Multer.File[] | undefined,
  ) {
    return this.misses.create(member, dto, files ?? []);
  }

  @Get(':id')
  findOne(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.misses.findOne(member, id);
  }

  @Roles(Role.owner, Role.parent)
  @Patch(':id')
  update(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: UpdateMissDto,
  ) {
    return this.misses.update(member, id, dto);
  }

  @Roles(Role.owner, Role.parent)
  @Delete(':id')
  @HttpCode(204)
  remove(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.misses.remove(member, id);
  }

  @Roles(Role.owner, Role.parent)
  @Post(':id/photos')
  @PhotoUpload()
  addPhotos(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @UploadedFiles() files: Express.Multer.File[] | undefined,
  ) {
    return this.misses.addPhotos(member, id, files ?? []);
  }
}
