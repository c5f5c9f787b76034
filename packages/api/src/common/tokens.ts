import { createHash, randomBytes } from 'node:crypto';

/** A random link token (256 bits, URL-safe) and the sha256 hex that is stored instead of it. */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** Tokens we issue are 43 base64url characters; anything else cannot be one of ours. */
export function looksLikeToken(value: unknown): value is string {
  return typeof value === 'string' && /^[A-Za-z0-9_-]{43}$/.test(value);
}
