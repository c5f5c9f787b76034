import { createHash } from 'node:crypto';

/**
 * A cache key for what a pure function is given: SHA-256 of its JSON, so inputs that print the
 * same share a key and any change to them makes another.
 */
export function contentDigest(value: unknown): string {
  return createHash('sha256').update(JSON.stringify(value)).digest('base64url');
}
