import { Body, Controller, Delete, Get, HttpCode, Put, Res, StreamableFile } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import type { Response } from 'express';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { SetMarksDto } from './dto/set-marks.dto.js';
import { PhotoFilesService } from './photo-files.service.js';
import type { PhotoFileKind } from './photos.service.js';

@ApiTags('photos')
@Controller('photos')
export class PhotosController {
  constructor(private readonly photos: PhotoFilesService) {}

  @Get(':id/image')
  image(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Res({ passthrough: true }) res: Response,
  ) {
    return this.send(member, id, 'image', res);
  }

  @Get(':id/thumb')
  thumb(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Res({ passthrough: true }) res: Response,
  ) {
    return this.send(member, id, 'thumb', res);
  }

  /** A small square (128 px) for list rows; made on first request for older photos. */
  @Get(':id/small')
  small(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Res({ passthrough: true }) res: Response,
  ) {
    return this.send(member, id, 'small', res);
  }

  /** Replaces the photo's pins (parents and granted tutors alike). */
  @Put(':id/marks')
  setMarks(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: SetMarksDto,
  ) {
    return this.photos.setMarks(member, id, dto.marks);
  }

  @Roles(Role.owner, Role.parent)
  @Delete(':id')
  @HttpCode(204)
  remove(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.photos.remove(member, id);
  }

  private async send(
    member: MemberContext,
    id: number,
    which: PhotoFileKind,
    res: Response,
  ): Promise<StreamableFile> {
    const file = await this.photos.file(member, id, which);
    // Private: a shared cache must never hold a child's work. A photo id's bytes never change.
    res.setHeader('Cache-Control', 'private, max-age=3600');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    return new StreamableFile(file.data, { type: file.contentType, length: file.data.length });
  }
}
