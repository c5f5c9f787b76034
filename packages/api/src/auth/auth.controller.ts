import { Body, Controller, Get, HttpCode, Post, Req, Res, UseGuards } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { ThrottlerGuard } from '@nestjs/throttler';
import type { Request, Response } from 'express';
import { CurrentUser } from '../common/decorators/current-member.decorator.js';
import { AllowNoHousehold, Public } from '../common/decorators/public.decorator.js';
import { anonymousToken, type CsrfCookieOptions } from '../common/guards/csrf-token.js';
import type { SessionUser } from '../common/member-context.js';
import type { AppConfig } from '../config/app.config.js';
import { EmailVerificationsService } from '../email-verifications/email-verifications.service.js';
import { publicOrigin } from '../mail/public-url.js';
import { AuthService } from './auth.service.js';
import { LoginDto } from './dto/login.dto.js';
import { RegisterDto } from './dto/register.dto.js';
import { LocalAuthGuard } from './local-auth.guard.js';
import {
  destroySession,
  logIn,
  logOut,
  newCsrfToken,
  startSignedInSession,
} from './session-lifetime.js';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  private readonly cookieName: string;
  private readonly publicUrl: string | undefined;
  private readonly csrfCookie: CsrfCookieOptions;

  constructor(
    private readonly auth: AuthService,
    private readonly verifications: EmailVerificationsService,
    config: ConfigService,
  ) {
    const { session } = config.getOrThrow<AppConfig>('app');
    this.cookieName = session.cookieName;
    this.publicUrl = config.getOrThrow<AppConfig>('app').publicUrl;
    this.csrfCookie = { secret: session.secret, secure: session.secure };
  }

  @Public()
  @Get('csrf')
  @ApiOperation({
    summary: 'The CSRF token of this session, or of this visitor (send it as x-csrf-token)',
  })
  csrf(@Req() req: Request, @Res({ passthrough: true }) res: Response) {
    if (req.session?.csrfToken) return { token: req.session.csrfToken };
    if (req.isAuthenticated()) {
      req.session.csrfToken = newCsrfToken();
      return { token: req.session.csrfToken };
    }
    // Visitors get a token tied to a cookie: no session row for every page that asks.
    return { token: anonymousToken(req, res, this.csrfCookie) };
  }

  @Public()
  @UseGuards(ThrottlerGuard)
  @Post('register')
  async register(@Body() dto: RegisterDto, @Req() req: Request) {
    const user = await this.auth.register(dto);
    await this.verifications.sendQuietly(user, publicOrigin(this.publicUrl, req));
    await logIn(req, user);
    startSignedInSession(req);
    return this.auth.describe(user, undefined);
  }

  @Public()
  @UseGuards(ThrottlerGuard, LocalAuthGuard)
  @Post('login')
  @HttpCode(200)
  @ApiOperation({ summary: 'Sign in with { email, password }' })
  login(@Body() _dto: LoginDto, @Req() req: Request, @CurrentUser() user: SessionUser) {
    startSignedInSession(req);
    return this.auth.describe(user, undefined);
  }

  @AllowNoHousehold()
  @Post('logout')
  @HttpCode(204)
  async logout(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<void> {
    await logOut(req);
    await destroySession(req);
    res.clearCookie(this.cookieName);
  }

  @AllowNoHousehold()
  @Get('me')
  me(@Req() req: Request, @CurrentUser() user: SessionUser) {
    return this.auth.describe(user, req.session.householdId);
  }
}
