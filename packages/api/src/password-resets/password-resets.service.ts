import {
  GoneException,
  Injectable,
  Logger,
  NotFoundException,
  type OnApplicationShutdown,
} from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { Op } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { PasswordService } from '../auth/password.service.js';
import { type LimitRule, LimitsService } from '../common/limits/limits.service.js';
import { hashToken, looksLikeToken, newLinkToken } from '../common/tokens.js';
import type { AppConfig } from '../config/app.config.js';
import { MailService } from '../mail/mail.service.js';
import { SessionStoreService } from '../sessions/session-store.service.js';
import { normalizeEmail, UsersService } from '../users/users.service.js';
import { PasswordResetToken } from './models/password-reset-token.model.js';

export const RESET_TTL_MS = 3_600_000;
export const RESET_REQUESTED =
  'If that e-mail has a Workback account, a link to set a new password is on its way. It works once, for one hour.';
export const UNKNOWN_RESET =
  'This password link is not valid: check that the whole link was copied, or ask for a new one';
export const USED_RESET = 'This password link has already been used: ask for a new one';
export const EXPIRED_RESET =
  'This password link has expired (they last one hour): ask for a new one';

@Injectable()
export class PasswordResetsService implements OnApplicationShutdown {
  private readonly logger = new Logger(PasswordResetsService.name);
  private readonly pending = new Set<Promise<void>>();
  private readonly perAddress: LimitRule;

  constructor(
    @InjectModel(PasswordResetToken) private readonly tokenModel: typeof PasswordResetToken,
    private readonly users: UsersService,
    private readonly passwords: PasswordService,
    private readonly mail: MailService,
    private readonly sessions: SessionStoreService,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly limits: LimitsService,
    config: ConfigService,
  ) {
    const hourly = config.getOrThrow<AppConfig>('app').limits.resetMailsPerAddressPerHour;
    this.perAddress = {
      name: 'reset-mails-address',
      limit: hourly,
      windowMs: 3_600_000,
      message: `A new-password link was asked for ${hourly} times in the last hour for that address: please use the newest mail, or wait an hour`,
    };
  }

  /**
   * Starts the work and returns at once, so the answer and its timing are the
   * same whether or not the address has an account (the per-address limit counts both alike).
   */
  async request(email: string, origin: string): Promise<void> {
    await this.limits.take(this.perAddress, normalizeEmail(email));
    const work = this.issue(email, origin).catch((err: unknown) => {
      // No address in the log: only that a reset mail failed.
      this.logger.error(`A password-reset mail could not be sent (${(err as Error).name})`);
    });
    this.pending.add(work);
    void work.finally(() => this.pending.delete(work));
  }

  async onApplicationShutdown(): Promise<void> {
    await Promise.all(this.pending);
  }

  /** Sets the new password, uses up the token and ends the account's other sessions. */
  async confirm(token: string, password: string, currentSid: string): Promise<void> {
    const row = looksLikeToken(token)
      ? await this.tokenModel.findOne({ where: { tokenHash: hashToken(token) } })
      : null;
    if (!row) throw new NotFoundException(UNKNOWN_RESET);
    if (row.usedAt) throw new GoneException(USED_RESET);
    if (row.expiresAt.getTime() <= Date.now()) throw new GoneException(EXPIRED_RESET);
    const passwordHash = await this.passwords.hash(password);
    await this.sequelize.transaction(async (transaction) => {
      const now = new Date();
      const [claimed] = await this.tokenModel.update(
        { usedAt: now },
        { where: { id: row.id, usedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
      );
      if (claimed !== 1) throw new GoneException(USED_RESET);
      await this.users.setPasswordHash(row.userId, passwordHash, transaction);
      await this.tokenModel.destroy({
        where: { userId: row.userId, id: { [Op.ne]: row.id } },
        transaction,
      });
    });
    await this.sessions.destroyForUsers([row.userId], currentSid);
  }

  private async issue(email: string, origin: string): Promise<void> {
    const user = await this.users.findByEmail(email);
    if (!user) return;
    const { token, hash } = newLinkToken();
    // Only the newest link works.
    await this.tokenModel.destroy({ where: { userId: user.id, usedAt: null } });
    const row = await this.tokenModel.create({
      userId: user.id,
      tokenHash: hash,
      expiresAt: new Date(Date.now() + RESET_TTL_MS),
    });
    try {
      await this.mail.send({
        to: user.email,
        subject: 'Set a new Workback password',
        paragraphs: [
          `Hello ${user.displayName},`,
          'Someone (we hope you) asked to set a new password for the Workback account of this address.',
          'The link works once, for one hour. Setting a new password signs this account out on every other device.',
          'If you did not ask for this, ignore this e-mail: your password stays as it is.',
        ],
        action: { label: 'Set a new password', url: `${origin}/reset-password/${token}` },
        sentBy: 'the Workback sign-in page',
        reason: 'because a new password was asked for with this address',
      });
    } catch (err) {
      await row.destroy();
      throw err;
    }
  }
}
