import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, Response } from 'express';

/**
 * Signed double-submit for visitors without a stored session: a random value in an HttpOnly
 * cookie, and a token that is its HMAC under the session secret. Nothing is stored on the
 * server, so fetching tokens costs no rows; a signed-in session keeps its own stored token.
 */
export const CSRF_COOKIE = 'workback.csrf';
const VALUE = /^[A-Za-z0-9_-]{43}$/;

export interface CsrfCookieOptions {
  secret: string;
  secure: boolean;
}

export function tokenFor(value: string, secret: string): string {
  return createHmac('sha256', secret).update(`workback-csrf:${value}`).digest('base64url');
}

export function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/** The random value of this visitor's CSRF cookie, if it has a well-formed one. */
export function csrfCookieValue(req: Request): string | undefined {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const at = part.indexOf('=');
    if (at > 0 && part.slice(0, at).trim() === CSRF_COOKIE) {
      const value = part.slice(at + 1).trim();
      return VALUE.test(value) ? value : undefined;
    }
  }
  return undefined;
}

/** The token for this visitor, setting the cookie it is tied to when there is none yet. */
export function anonymousToken(req: Request, res: Response, o: CsrfCookieOptions): string {
  let value = csrfCookieValue(req);
  if (!value) {
    value = randomBytes(32).toString('base64url');
    res.cookie(CSRF_COOKIE, value, {
      httpOnly: true,
      sameSite: 'lax',
      secure: o.secure,
      path: '/',
    });
  }
  return tokenFor(value, o.secret);
}

/** True when `given` is the token tied to this visitor's CSRF cookie. */
export function anonymousTokenMatches(req: Request, given: string, secret: string): boolean {
  const value = csrfCookieValue(req);
  return value !== undefined && sameToken(tokenFor(value, secret), given);
}
