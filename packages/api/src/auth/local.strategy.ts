import { Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { Strategy } from 'passport-local';
import type { SessionUser } from '../common/member-context.js';
import { AuthService } from './auth.service.js';

export const WRONG_CREDENTIALS = 'That e-mail and password do not match an account';

@Injectable()
export class LocalStrategy extends PassportStrategy(Strategy) {
  constructor(private readonly auth: AuthService) {
    super({ usernameField: 'email', passwordField: 'password' });
  }

  async validate(email: string, password: string): Promise<SessionUser> {
    const user = await this.auth.validateUser(email, password);
    if (!user) throw new UnauthorizedException(WRONG_CREDENTIALS);
    return user;
  }
}
