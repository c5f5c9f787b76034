import { Injectable } from '@nestjs/common';
import { PassportSerializer } from '@nestjs/passport';
import type { SessionUser } from '../common/member-context.js';
import { AuthService } from './auth.service.js';

/** Only the user id lives in the session; the rest is read fresh on each request. */
@Injectable()
export class SessionSerializer extends PassportSerializer {
  constructor(private readonly auth: AuthService) {
    super();
  }

  serializeUser(user: SessionUser, done: (err: Error | null, id?: number) => void): void {
    done(null, user.id);
  }

  deserializeUser(id: number, done: (err: Error | null, user?: SessionUser | false) => void): void {
    this.auth.findSessionUser(id).then(
      (user) => done(null, user ?? false),
      (err: Error) => done(err),
    );
  }
}
