import {
  Body,
  Controller,
  Delete,
  Get,
  Header,
  HttpCode,
  Patch,
  Post,
  Query,
  Req,
  Res,
  UnsupportedMediaTypeException,
  UploadedFile,
} from '@nestjs/common';
import { ApiBody, ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import type { Request, Response } from 'express';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { AnswerKeysService } from './answer-keys.service.js';
import { CreateAnswerKeyDto } from './dto/create-answer-key.dto.js';
import { ImportAnswerKeyBody, ImportAnswerKeyDto } from './dto/import-answer-key.dto.js';
import { ListAnswerKeysQuery } from './dto/list-answer-keys.query.js';
import { UpdateAnswerKeyDto } from './dto/update-answer-key.dto.js';
import { KeyCorrectionsService } from './key-corrections.service.js';
import { KeyImportService } from './key-import.service.js';
import { KeyUpload } from './key-upload.js';

@ApiTags('answer keys')
@Controller('answer-keys')
export class AnswerKeysController {
  constructor(
    private readonly keys: AnswerKeysService,
    private readonly csv: KeyImportService,
    private readonly corrections: KeyCorrectionsService,
  ) {}

  @Get()
  findAll(@CurrentMember() member: MemberContext, @Query() query: ListAnswerKeysQuery) {
    return this.keys.findAll(member, query);
  }

  @Roles(Role.owner, Role.parent)
  @Post()
  create(@CurrentMember() member: MemberContext, @Body() dto: CreateAnswerKeyDto) {
    return this.keys.create(member, dto);
  }

  @Roles(Role.owner, Role.parent)
  @Post('import')
  @KeyUpload()
  @ApiBody({ type: ImportAnswerKeyBody })
  import(
    @CurrentMember() member: MemberContext,
    @Req() req: Request,
    @Body() dto: ImportAnswerKeyDto,
    @UploadedFile() file?: Express.Multer.File,
  ) {
    if (!req.is('multipart/form-data')) {
      throw new UnsupportedMediaTypeException(
        'Send the key as multipart/form-data with the CSV in “file”',
      );
    }
    return this.csv.importCsv(member, dto, file);
  }

  @Get(':id')
  findOne(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.keys.findOne(member, id);
  }

  @Get(':id/export.csv')
  @Header('Content-Type', 'text/csv; charset=utf-8')
  async exportCsv(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Res({ passthrough: true }) res: Response,
  ) {
    const { filename, body } = await this.csv.exportCsv(member, id);
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    return body;
  }

  @Roles(Role.owner, Role.parent)
  @Patch(':id')
  update(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: UpdateAnswerKeyDto,
  ) {
    return this.corrections.update(member, id, dto);
  }

  @Roles(Role.owner, Role.parent)
  @Delete(':id')
  @HttpCode(204)
  remove(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.keys.remove(member, id);
  }
}
