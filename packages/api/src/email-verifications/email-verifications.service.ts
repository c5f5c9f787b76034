import {
  ConflictException,
  GoneException,
  Injectable,
  Logger,
  NotFoundException,
} from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { Op } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { SessionUser } from '../common/member-context.js';
import { hashToken, looksLikeToken, newLinkToken } from '../common/tokens.js';
import { MailService } from '../mail/mail.service.js';
import { UsersService } from '../users/users.service.js';
import { EmailVerificationToken } from './models/email-verification-token.model.js';

export const VERIFY_TTL_HOURS = 48;
export const VERIFICATION_SENT =
  'A link to confirm your address is on its way. It works once, for 48 hours.';
export const ALREADY_VERIFIED = 'Your e-mail address is already confirmed';
export const UNKNOWN_VERIFICATION =
  'This confirmation link is not valid: check that the whole link was copied, or ask for a new one from the app';
export const USED_VERIFICATION =
  'This confirmation link has already been used (only the newest link works): ask for a new one from the app';
export const EXPIRED_VERIFICATION = `This confirmation link has expired (they last ${VERIFY_TTL_HOURS} hours): ask for a new one from the app`;
export const VERIFY_BEFORE_INVITING =
  'Please confirm your e-mail address before inviting anyone: open the link we sent you, or ask for a new one';

interface Addressee {
  id: number;
  email: string;
  displayName: string;
}

/** Proves that an account's owner reads its address: a mailed link that works once. */
@Injectable()
export class EmailVerificationsService {
  private readonly logger = new Logger(EmailVerificationsService.name);

  constructor(
    @InjectModel(EmailVerificationToken) private readonly tokenModel: typeof EmailVerificationToken,
    private readonly users: UsersService,
    private readonly mail: MailService,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  /** Mails a fresh link; only the newest one works. A refused mail leaves no token (503). */
  async send(user: Addressee, origin: string): Promise<void> {
    const { token, hash } = newLinkToken();
    await this.tokenModel.destroy({ where: { userId: user.id, usedAt: null } });
    const row = await this.tokenModel.create({
      userId: user.id,
      email: user.email,
      tokenHash: hash,
      expiresAt: new Date(Date.now() + VERIFY_TTL_HOURS * 3_600_000),
    });
    try {
      await this.mail.send({
        to: user.email,
        subject: 'Confirm your e-mail address for Workback',
        paragraphs: [
          `Hello ${user.displayName},`,
          'Please confirm that this address is yours by opening the link below. Until then you can use Workback, but not invite anyone to your household.',
          `The link works once, for ${VERIFY_TTL_HOURS} hours.`,
          'If you did not make a Workback account, ignore this e-mail.',
        ],
        action: { label: 'Confirm my address', url: `${origin}/verify-email/${token}` },
        sentBy: 'Workback',
        reason: 'because a Workback account was made with this address',
      });
    } catch (err) {
      await row.destroy();
      throw err;
    }
  }

  /** After sign-up: a mail that cannot be sent now does not undo the account (it can be asked again). */
  async sendQuietly(user: Addressee, origin: string): Promise<void> {
    await this.send(user, origin).catch((err: unknown) => {
      this.logger.error(`An address confirmation mail could not be sent (${(err as Error).name})`);
    });
  }

  /** The signed-in user asks for a new link. */
  async resend(user: SessionUser, origin: string): Promise<void> {
    if (user.emailVerified) throw new ConflictException(ALREADY_VERIFIED);
    await this.send(user, origin);
  }

  /** Marks the address verified and uses up the link (single use even under a race). */
  async confirm(token: string): Promise<{ email: string }> {
    const row = looksLikeToken(token)
      ? await this.tokenModel.findOne({ where: { tokenHash: hashToken(token) } })
      : null;
    const user = row ? await this.users.findById(row.userId) : null;
    // A link for an address the account no longer has proves nothing.
    if (!row || !user || user.email !== row.email)
      throw new NotFoundException(UNKNOWN_VERIFICATION);
    if (row.usedAt) throw new GoneException(USED_VERIFICATION);
    if (row.expiresAt.getTime() <= Date.now()) throw new GoneException(EXPIRED_VERIFICATION);
    await this.sequelize.transaction(async (transaction) => {
      const now = new Date();
      const [claimed] = await this.tokenModel.update(
        { usedAt: now },
        { where: { id: row.id, usedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
      );
      if (claimed !== 1) throw new GoneException(USED_VERIFICATION);
      await this.users.markEmailVerified(row.userId, transaction);
      await this.tokenModel.destroy({
        where: { userId: row.userId, id: { [Op.ne]: row.id } },
        transaction,
      });
    });
    return { email: user.email };
  }
}
