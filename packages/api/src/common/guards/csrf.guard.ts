import {
  type CanActivate,
  type ExecutionContext,
  ForbiddenException,
  Injectable,
} from '@nestjs/common';
import type { Request } from 'express';
import { timingSafeEqual } from 'node:crypto';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Synchronizer token: every state-changing request repeats the session's token in a header. */
@Injectable()
export class CsrfGuard implements CanActivate {
  canActivate(context: ExecutionContext): boolean {
    const req = context.switchToHttp().getRequest<Request>();
    if (SAFE_METHODS.has(req.method)) return true;
    const expected = req.session?.csrfToken;
    const given = req.get('x-csrf-token');
    if (!expected || !given || !sameToken(expected, given)) {
      throw new ForbiddenException(
        'Missing or stale CSRF token: fetch GET /api/auth/csrf and send it as x-csrf-token',
      );
    }
    return true;
  }
}

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}
