import {
  ConflictException,
  GoneException,
  Injectable,
  NotFoundException,
  UnauthorizedException,
} from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { Role } from '@workback/core';
import { Op, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { PasswordService } from '../auth/password.service.js';
import type { MemberContext, SessionUser } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { hashToken, looksLikeToken } from '../common/tokens.js';
import { HouseholdsService } from '../households/households.service.js';
import { MembersService } from '../households/members.service.js';
import { StudentsService } from '../students/students.service.js';
import { normalizeEmail, UsersService } from '../users/users.service.js';
import type { AcceptInvitationDto } from './dto/accept-invitation.dto.js';
import { Invitation } from './models/invitation.model.js';

export const UNKNOWN_INVITATION =
  'This invitation link is not valid: check that the whole link was copied, or ask for a new one';
export const USED_INVITATION = 'This invitation has already been used: ask for a new one';
export const EXPIRED_INVITATION = 'This invitation has expired: ask for a new one';

export const SIGN_IN_TO_JOIN =
  'To join with this e-mail, sign in first, then open this link again; or choose another e-mail for a new account';
const SIGN_IN_FIELDS = {
  email: 'to join with this e-mail, sign in with its password first',
  password: 'to join with this e-mail, sign in with its password first',
};

export interface AcceptResult {
  userId: number;
  householdId: number;
  /** The session is to be signed in as this user (a new account, or an account's password). */
  signIn: boolean;
  /** A new account whose address is still to be confirmed by a mailed link. */
  unverified?: { id: number; email: string; displayName: string };
}

/** An invitation link opened: what it is for, and joining the household with it (once). */
@Injectable()
export class InvitationAcceptanceService {
  constructor(
    @InjectModel(Invitation) private readonly invitationModel: typeof Invitation,
    private readonly households: HouseholdsService,
    private readonly members: MembersService,
    private readonly students: StudentsService,
    private readonly users: UsersService,
    private readonly passwords: PasswordService,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  /** What the acceptance page shows before the person decides. */
  async preview(token: string) {
    const invitation = await this.findUsable(token);
    const household = await this.households.findCurrent(householdReader(invitation.householdId));
    const inviter = invitation.invitedById
      ? await this.users.findById(invitation.invitedById)
      : null;
    return {
      email: invitation.email,
      role: invitation.role,
      householdName: household.name,
      invitedByName: inviter?.displayName ?? null,
      expiresAt: invitation.expiresAt,
    };
  }

  /**
   * Adds the signed-in user, or the person the body describes, to the invitation's household.
   * Single use even under a race: the claim is a conditional update inside the same
   * transaction as the membership. An e-mail that already has an account is never said to
   * have one and never uses the invitation up: with that account's password it joins, as if
   * signed in first; without it the answer is the one any acceptance that needs a sign-in gets.
   */
  async accept(
    token: string,
    dto: AcceptInvitationDto,
    current: SessionUser | undefined,
  ): Promise<AcceptResult> {
    const invitation = await this.findUsable(token);
    const studentIds = await this.stillPresentStudents(invitation);
    if (current) {
      if (dto.password !== undefined || dto.displayName !== undefined || dto.email !== undefined) {
        throw fieldsError({
          password: `you are signed in as ${current.email}: accept without a new account, or sign out first`,
        });
      }
      await this.join(invitation, current, studentIds);
      return { userId: current.id, householdId: invitation.householdId, signIn: false };
    }

    const missing: Record<string, string> = {};
    if (dto.displayName === undefined)
      missing.displayName = 'displayName is needed for a new account';
    if (dto.password === undefined) missing.password = 'password must be 8 to 128 characters';
    if (Object.keys(missing).length > 0) throw fieldsError(missing);
    const email = normalizeEmail(dto.email ?? invitation.email);
    const existing = await this.users.findByEmail(email);
    if (existing) {
      if (!(await this.passwords.verify(existing.passwordHash, dto.password!))) {
        throw new UnauthorizedException({ message: SIGN_IN_TO_JOIN, fields: SIGN_IN_FIELDS });
      }
      await this.join(invitation, existing, studentIds);
      return { userId: existing.id, householdId: invitation.householdId, signIn: true };
    }
    // The link was mailed to the invitation's address: an account made with it has proved it.
    const proved = email === invitation.email;
    const passwordHash = await this.passwords.hash(dto.password!);
    const user = await this.sequelize.transaction(async (transaction) => {
      const created = await this.users.create(
        {
          email,
          displayName: dto.displayName!,
          passwordHash,
          ...(proved ? { emailVerifiedAt: new Date() } : {}),
        },
        transaction,
      );
      await this.claim(invitation, created.id, transaction);
      await this.households.addMember(
        invitation.householdId,
        created.id,
        invitation.role,
        studentIds,
        transaction,
      );
      return created;
    });
    return {
      userId: user.id,
      householdId: invitation.householdId,
      signIn: true,
      ...(proved ? {} : { unverified: user }),
    };
  }

  private async join(
    invitation: Invitation,
    user: { id: number; email: string },
    studentIds: number[],
  ): Promise<void> {
    const userId = user.id;
    if (await this.members.isMember(invitation.householdId, user.email)) {
      throw new ConflictException('You are already a member of this household');
    }
    await this.sequelize.transaction(async (transaction) => {
      await this.claim(invitation, userId, transaction);
      await this.households.addMember(
        invitation.householdId,
        userId,
        invitation.role,
        studentIds,
        transaction,
      );
    });
  }

  private async findUsable(token: string): Promise<Invitation> {
    const invitation = looksLikeToken(token)
      ? await this.invitationModel.findOne({ where: { tokenHash: hashToken(token) } })
      : null;
    if (!invitation) throw new NotFoundException(UNKNOWN_INVITATION);
    if (invitation.acceptedAt) throw new GoneException(USED_INVITATION);
    if (invitation.expiresAt.getTime() <= Date.now()) throw new GoneException(EXPIRED_INVITATION);
    return invitation;
  }

  private async claim(
    invitation: Invitation,
    userId: number,
    transaction: Transaction,
  ): Promise<void> {
    const now = new Date();
    const [claimed] = await this.invitationModel.update(
      { acceptedAt: now, acceptedById: userId },
      {
        where: { id: invitation.id, acceptedAt: null, expiresAt: { [Op.gt]: now } },
        transaction,
      },
    );
    if (claimed !== 1) throw new GoneException(USED_INVITATION);
  }

  /** A tutor's students that are still in the household (one may have been removed since). */
  private async stillPresentStudents(invitation: Invitation): Promise<number[]> {
    if (invitation.role !== Role.tutor) return [];
    const { items } = await this.students.findAll(householdReader(invitation.householdId));
    const present = new Set(items.map((s) => s.id));
    const ids = invitation.studentIds.filter((id) => present.has(id));
    if (ids.length === 0) {
      throw new ConflictException(
        'The students this invitation was for are no longer in the household: ask for a new invitation',
      );
    }
    return ids;
  }
}

/** A read scope over one household's students, for checks made on nobody's behalf. */
function householdReader(householdId: number): MemberContext {
  return { userId: 0, membershipId: 0, householdId, role: Role.owner, studentIds: null };
}
