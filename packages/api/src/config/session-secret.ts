import { randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/** A per-installation secret, made once and kept beside the data it protects. */
export function loadOrCreateSecret(dataDir: string): string {
  const file = path.join(dataDir, 'session-secret');
  try {
    return readFileSync(file, 'utf8').trim();
  } catch {
    mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    const secret = randomBytes(48).toString('base64url');
    writeFileSync(file, secret, { mode: 0o600, flag: 'wx' });
    return secret;
  }
}
