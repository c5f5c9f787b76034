import { Body, Controller, HttpCode, Post, Req, UseGuards } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { ThrottlerGuard } from '@nestjs/throttler';
import type { Request } from 'express';
import { CurrentUser } from '../common/decorators/current-member.decorator.js';
import { AllowNoHousehold, Public } from '../common/decorators/public.decorator.js';
import type { SessionUser } from '../common/member-context.js';
import type { AppConfig } from '../config/app.config.js';
import { publicOrigin } from '../mail/public-url.js';
import { ConfirmEmailVerificationDto } from './dto/confirm-email-verification.dto.js';
import { EmailVerificationsService, VERIFICATION_SENT } from './email-verifications.service.js';

@ApiTags('auth')
@Controller('auth/email-verification')
export class EmailVerificationsController {
  private readonly publicUrl: string | undefined;

  constructor(
    private readonly verifications: EmailVerificationsService,
    config: ConfigService,
  ) {
    this.publicUrl = config.getOrThrow<AppConfig>('app').publicUrl;
  }

  @AllowNoHousehold()
  @UseGuards(ThrottlerGuard)
  @Post()
  @HttpCode(202)
  @ApiOperation({ summary: 'Mail a new link to confirm the signed-in account’s address' })
  async resend(@CurrentUser() user: SessionUser, @Req() req: Request) {
    await this.verifications.resend(user, publicOrigin(this.publicUrl, req));
    return { message: VERIFICATION_SENT };
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @Post('confirm')
  @HttpCode(200)
  @ApiOperation({ summary: 'Confirm an address with the token from the mailed link' })
  async confirm(@Body() dto: ConfirmEmailVerificationDto) {
    const { email } = await this.verifications.confirm(dto.token);
    return { message: `Thank you: ${email} is confirmed.`, email };
  }
}
