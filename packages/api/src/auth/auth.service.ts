import { Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectConnection } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { AppConfig } from '../config/app.config.js';
import type { SessionUser } from '../common/member-context.js';
import { MemberCache } from '../households/member-cache.js';
import { HouseholdsService } from '../households/households.service.js';
import type { User } from '../users/models/user.model.js';
import { UsersService } from '../users/users.service.js';
import type { RegisterDto } from './dto/register.dto.js';
import { PasswordService } from './password.service.js';

@Injectable()
export class AuthService {
  private readonly adminEmails: readonly string[];

  constructor(
    private readonly users: UsersService,
    private readonly households: HouseholdsService,
    private readonly cache: MemberCache,
    private readonly passwords: PasswordService,
    @InjectConnection() private readonly sequelize: Sequelize,
    config: ConfigService,
  ) {
    this.adminEmails = config.getOrThrow<AppConfig>('app').adminEmails;
  }

  /** Same answer for an unknown e-mail and a wrong password. */
  async validateUser(email: string, password: string): Promise<SessionUser | null> {
    const user = await this.users.findByEmail(email);
    if (!user) return this.passwords.verifyNothing(password).then(() => null);
    return (await this.passwords.verify(user.passwordHash, password))
      ? this.toSessionUser(user)
      : null;
  }

  /** A new household and its owner, both or neither. */
  async register(dto: RegisterDto): Promise<SessionUser> {
    const passwordHash = await this.passwords.hash(dto.password);
    const user = await this.sequelize.transaction(async (transaction) => {
      const created = await this.users.create(
        { email: dto.email, displayName: dto.displayName, passwordHash },
        transaction,
      );
      await this.households.createWithOwner(dto.householdName, created.id, transaction);
      return created;
    });
    return this.toSessionUser(user);
  }

  /** Read through MemberCache: a signed-in request does not read `users` each time. */
  findSessionUser(id: number): Promise<SessionUser | null> {
    return this.cache.user(id, async () => {
      const user = await this.users.findById(id);
      return user ? this.toSessionUser(user) : null;
    });
  }

  async describe(user: SessionUser, householdId: number | undefined) {
    const households = await this.households.listForUser(user.id);
    return {
      user,
      household: households.find((h) => h.id === householdId) ?? households[0] ?? null,
      households,
    };
  }

  toSessionUser(user: User): SessionUser {
    const emailVerified = Boolean(user.emailVerifiedAt);
    return {
      id: user.id,
      email: user.email,
      displayName: user.displayName,
      emailVerified,
      // Whoever registers an admin address first must not become admin: it takes the mailbox.
      isAdmin: emailVerified && this.adminEmails.includes(user.email),
    };
  }
}
