import {
  Body,
  Controller,
  Delete,
  ForbiddenException,
  Get,
  HttpCode,
  Param,
  Post,
  Req,
  UseGuards,
} from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { ThrottlerGuard } from '@nestjs/throttler';
import { Role } from '@workback/core';
import type { Request } from 'express';
import { AuthService } from '../auth/auth.service.js';
import { logIn, startSignedInSession } from '../auth/session-lifetime.js';
import { CurrentMember, CurrentUser } from '../common/decorators/current-member.decorator.js';
import { IdParam } from '../common/decorators/id-param.decorator.js';
import { Public } from '../common/decorators/public.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import type { MemberContext, SessionUser } from '../common/member-context.js';
import type { AppConfig } from '../config/app.config.js';
import {
  EmailVerificationsService,
  VERIFY_BEFORE_INVITING,
} from '../email-verifications/email-verifications.service.js';
import { publicOrigin } from '../mail/public-url.js';
import { AcceptInvitationDto } from './dto/accept-invitation.dto.js';
import { CreateInvitationDto } from './dto/create-invitation.dto.js';
import { InvitationAcceptanceService } from './invitation-acceptance.service.js';
import { InvitationsService } from './invitations.service.js';

@ApiTags('invitations')
@Controller('invitations')
export class InvitationsController {
  private readonly publicUrl: string | undefined;

  constructor(
    private readonly invitations: InvitationsService,
    private readonly acceptance: InvitationAcceptanceService,
    private readonly auth: AuthService,
    private readonly verifications: EmailVerificationsService,
    config: ConfigService,
  ) {
    this.publicUrl = config.getOrThrow<AppConfig>('app').publicUrl;
  }

  @Roles(Role.owner, Role.parent)
  @Get()
  findAll(@CurrentMember() member: MemberContext) {
    return this.invitations.findAll(member);
  }

  @Roles(Role.owner, Role.parent)
  @Post()
  @ApiOperation({ summary: 'Invite a parent or a tutor by e-mail (the link is only in the mail)' })
  create(
    @CurrentMember() member: MemberContext,
    @CurrentUser() user: SessionUser,
    @Body() dto: CreateInvitationDto,
    @Req() req: Request,
  ) {
    if (!user.emailVerified) throw new ForbiddenException(VERIFY_BEFORE_INVITING);
    return this.invitations.create(member, user, dto, publicOrigin(this.publicUrl, req));
  }

  @Roles(Role.owner, Role.parent)
  @Delete(':id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Withdraw an invitation that has not been accepted' })
  remove(@CurrentMember() member: MemberContext, @IdParam() id: number) {
    return this.invitations.remove(member, id);
  }

  @Public()
  @Get(':token')
  @ApiOperation({ summary: 'What an invitation link is for, before accepting it' })
  preview(@Param('token') token: string) {
    return this.acceptance.preview(token);
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @Post(':token/accept')
  @HttpCode(200)
  @ApiOperation({
    summary:
      'Accept: signed in, with an empty body; or as a new person with { displayName, password, email? }',
  })
  async accept(
    @Param('token') token: string,
    @Body() dto: AcceptInvitationDto,
    @Req() req: Request,
  ) {
    const current = req.isAuthenticated() ? req.user : undefined;
    const result = await this.acceptance.accept(token, dto, current);
    const user = current ?? (await this.auth.findSessionUser(result.userId))!;
    if (result.unverified) {
      await this.verifications.sendQuietly(result.unverified, publicOrigin(this.publicUrl, req));
    }
    if (result.signIn) {
      await logIn(req, user);
      startSignedInSession(req);
    }
    req.session.householdId = result.householdId;
    return this.auth.describe(user, result.householdId);
  }
}
