import { randomBytes } from 'node:crypto';
import type { Request } from 'express';

export function newCsrfToken(): string {
  return randomBytes(32).toString('base64url');
}

/** Marks the start of a signed-in session (for the absolute lifetime) and its CSRF token. */
export function startSignedInSession(req: Request): void {
  req.session.signedInAt = Date.now();
  req.session.csrfToken = newCsrfToken();
}

/** Promise wrappers over passport's callback API. */
export function logIn(req: Request, user: Express.User): Promise<void> {
  return new Promise((resolve, reject) =>
    req.logIn(user, (err) => (err ? reject(err) : resolve())),
  );
}

export function logOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
}

export function destroySession(req: Request): Promise<void> {
  return new Promise((resolve, reject) =>
    req.session.destroy((err: unknown) => (err ? reject(err as Error) : resolve())),
  );
}
