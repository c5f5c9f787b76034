import {
  Body,
  Controller,
  Get,
  Header,
  HttpCode,
  Patch,
  Post,
  Query,
  Req,
  Res,
  StreamableFile,
} from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Role } from '@workback/core';
import { ConfigService } from '@nestjs/config';
import type { Request, Response } from 'express';
import type { AppConfig } from '../config/app.config.js';
import { publicOrigin } from '../mail/public-url.js';
import { CurrentMember } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext } from '../common/member-context.js';
import { CreateReviewPlanDto } from './dto/create-review-plan.dto.js';
import { ListReviewPlansQuery } from './dto/list-review-plans.query.js';
import { SendReviewPlanDto } from './dto/send-review-plan.dto.js';
import { UpdateReviewPlanDto } from './dto/update-review-plan.dto.js';
import { ReviewPlanExportsService } from './review-plan-exports.service.js';
import { ReviewPlanMakingService } from './review-plan-making.service.js';
import { ReviewPlansService } from './review-plans.service.js';

/** Owners, parents and granted tutors build and check off plans; only parents e-mail them. */
@ApiTags('review-plans')
@Controller('review-plans')
export class ReviewPlansController {
  private readonly publicUrl: string | undefined;

  constructor(
    private readonly plans: ReviewPlansService,
    private readonly making: ReviewPlanMakingService,
    private readonly exports: ReviewPlanExportsService,
    config: ConfigService,
  ) {
    this.publicUrl = config.getOrThrow<AppConfig>('app').publicUrl;
  }

  @Get()
  findAll(@CurrentMember() member: MemberContext, @Query() query: ListReviewPlansQuery) {
    return this.plans.findAll(member, query);
  }

  @Post()
  create(@CurrentMember() member: MemberContext, @Body() dto: CreateReviewPlanDto) {
    return this.making.create(member, dto);
  }

  @Get(':id')
  findOne(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.plans.findOne(member, id);
  }

  @Patch(':id')
  update(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: UpdateReviewPlanDto,
  ) {
    return this.plans.update(member, id, dto);
  }

  @Get(':id/export.pdf')
  async exportPdf(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    const { filename, body } = await this.exports.pdf(member, id);
    return new StreamableFile(body, {
      type: 'application/pdf',
      disposition: `attachment; filename="${filename}"`,
    });
  }

  @Get(':id/export.csv')
  @Header('Content-Type', 'text/csv; charset=utf-8')
  async exportCsv(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Res({ passthrough: true }) res: Response,
  ) {
    const { filename, body } = await this.exports.csv(member, id);
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    return body;
  }

  @Roles(Role.owner, Role.parent)
  @Post(':id/send')
  @HttpCode(200)
  send(
    @CurrentMember() member: MemberContext,
    @IdParam() id: number,
    @Body() dto: SendReviewPlanDto,
    @Req() req: Request,
  ) {
    return this.exports.send(member, id, dto, publicOrigin(this.publicUrl, req));
  }
}
