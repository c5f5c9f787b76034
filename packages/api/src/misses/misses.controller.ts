import {
  Body,
  Controller,
  Delete,
  Get,
  Headers,
  HttpCode,
  Patch,
  Post,
  Query,
  Res,
  UploadedFiles,
} from '@nestjs/common';
import { ApiHeader, ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import type { Response } from 'express';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { sendJsonOnce } from '../common/responses/json-once.js';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { PhotoUpload } from '../photos/photo-upload.js';
import { CreateMissDto } from './dto/create-miss.dto.js';
import { ListMissesQuery } from './dto/list-misses.query.js';
import { UpdateMissDto } from './dto/update-miss.dto.js';
import { MissPhotosService } from './miss-photos.service.js';
import { MissSearchService } from './miss-search.service.js';
import { MissesService } from './misses.service.js';

/** A client-made key, e.g. a UUID: long enough not to be guessed, short enough to index. */
const IDEMPOTENCY_KEY = /^[A-Za-z0-9_-]{16,100}$/;

@ApiTags('misses')
@Controller('misses')
export class MissesController {
  constructor(
    private readonly misses: MissesService,
    private readonly search: MissSearchService,
    private readonly photos: MissPhotosService,
  ) {}

  @Get()
  async findAll(
    @CurrentMember() member: MemberContext,
    @Query() query: ListMissesQuery,
    @Res() res: Response,
  ): Promise<void> {
    // Pages are kept between reads (PageCache): each is written as JSON, and gzipped, once.
    sendJsonOnce(res, await this.search.findAll(member, query));
  }

  @Roles(Role.owner, Role.parent)
  @Post()
  @PhotoUpload()
  @ApiHeader({
    name: 'Idempotency-Key',
    required: false,
    description:
      'Makes the request safe to send again: the same key in this household answers the first miss (200); the key with other content is a 409.',
  })
  async create(
    @CurrentMember() member: MemberContext,
    @Body() dto: CreateMissDto,
    @UploadedFiles() files: Express.Multer.File[] | undefined,
    @Headers('idempotency-key') key: string | undefined,
    @Res({ passthrough: true }) res: Response,
  ) {
    if (key === undefined) return this.misses.create(member, dto, files ?? []);
    if (!IDEMPOTENCY_KEY.test(key)) {
      throw fieldsError({
        'idempotency-key': 'must be 16 to 100 letters, digits, "-" or "_"',
      });
    }
    const { miss, replayed } = await this.misses.createOnce(member, dto, files ?? [], key);
    if (replayed) res.status(200);
    return miss;
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
    return this.photos.addPhotos(member, id, files ?? []);
  }
}
