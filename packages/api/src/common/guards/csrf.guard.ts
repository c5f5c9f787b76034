import {
  type CanActivate,
  type ExecutionContext,
  ForbiddenException,
  Injectable,
} from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { Request } from 'express';
import type { AppConfig } from '../../config/app.config.js';
import { anonymousTokenMatches, sameToken } from './csrf-token.js';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Every state-changing request repeats a token in `x-csrf-token`: the one stored in the session
 * once there is a session with one (signed in), else the one tied to the visitor's CSRF cookie.
 */
@Injectable()
export class CsrfGuard implements CanActivate {
  private readonly secret: string;

  constructor(config: ConfigService) {
    this.secret = config.getOrThrow<AppConfig>('app').session.secret;
  }

  canActivate(context: ExecutionContext): boolean {
    const req = context.switchToHttp().getRequest<Request>();
    if (SAFE_METHODS.has(req.method)) return true;
    const stored = req.session?.csrfToken;
    const given = req.get('x-csrf-token');
    const ok =
      given !== undefined &&
      (stored ? sameToken(stored, given) : anonymousTokenMatches(req, given, this.secret));
    if (!ok) {
      throw new ForbiddenException(
        'Missing or stale CSRF token: fetch GET /api/auth/csrf and send it as x-csrf-token',
      );
    }
    return true;
  }
}
