import type { Request } from 'express';

/**
 * The origin links in e-mail point at: PUBLIC_URL when set (always set it in
 * production: without it the request's Host header decides), else the request's.
 */
export function publicOrigin(publicUrl: string | undefined, req: Request): string {
  return (publicUrl ?? `${req.protocol}://${req.get('host') ?? 'localhost'}`).replace(/\/+$/, '');
}
