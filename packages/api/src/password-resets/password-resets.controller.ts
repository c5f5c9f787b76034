import { Body, Controller, HttpCode, Post, Req, UseGuards } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { ThrottlerGuard } from '@nestjs/throttler';
import type { Request } from 'express';
import { Public } from '../common/decorators/public.decorator.js';
import type { AppConfig } from '../config/app.config.js';
import { publicOrigin } from '../mail/public-url.js';
import { ConfirmPasswordResetDto } from './dto/confirm-password-reset.dto.js';
import { RequestPasswordResetDto } from './dto/request-password-reset.dto.js';
import { PasswordResetsService, RESET_REQUESTED } from './password-resets.service.js';

@ApiTags('auth')
@Controller('auth/password-reset')
export class PasswordResetsController {
  private readonly publicUrl: string | undefined;

  constructor(
    private readonly resets: PasswordResetsService,
    config: ConfigService,
  ) {
    this.publicUrl = config.getOrThrow<AppConfig>('app').publicUrl;
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @Post()
  @HttpCode(202)
  @ApiOperation({
    summary: 'E-mail a single-use link to set a new password (same answer for any address)',
  })
  async request(@Body() dto: RequestPasswordResetDto, @Req() req: Request) {
    await this.resets.request(dto.email, publicOrigin(this.publicUrl, req));
    return { message: RESET_REQUESTED };
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @Post('confirm')
  @HttpCode(200)
  @ApiOperation({ summary: 'Set the new password with the token from the link' })
  async confirm(@Body() dto: ConfirmPasswordResetDto, @Req() req: Request) {
    await this.resets.confirm(dto.token, dto.password, req.sessionID);
    return { message: 'Your new password is set. Please sign in with it.' };
  }
}
