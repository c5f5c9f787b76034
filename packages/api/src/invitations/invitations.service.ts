import {
  ConflictException,
  GoneException,
  Injectable,
  NotFoundException,
  UnauthorizedException,
} from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { Role } from '@workback/core';
import { Op } from 'sequelize';
import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { PasswordService } from '../auth/password.service.js';
import { type LimitRule, LimitsService } from '../common/limits/limits.service.js';
import type { MemberContext, SessionUser } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { hashToken, looksLikeToken, newLinkToken } from '../common/tokens.js';
import { HouseholdsService } from '../households/households.service.js';
import { MembersService, ONLY_TUTORS_GET_STUDENTS } from '../households/members.service.js';
import { MailService } from '../mail/mail.service.js';
import { StudentsService } from '../students/students.service.js';
import type { AppConfig } from '../config/app.config.js';
import { User } from '../users/models/user.model.js';
import { normalizeEmail, UsersService } from '../users/users.service.js';
import type { AcceptInvitationDto } from './dto/accept-invitation.dto.js';
import type { CreateInvitationDto } from './dto/create-invitation.dto.js';
import { Invitation } from './models/invitation.model.js';

export const INVITATION_DAYS = 7;
const DAY_MS = 86_400_000;

export const UNKNOWN_INVITATION =
  'This invitation link is not valid: check that the whole link was copied, or ask for a new one';
export const USED_INVITATION = 'This invitation has already been used: ask for a new one';
export const EXPIRED_INVITATION = 'This invitation has expired: ask for a new one';

export type InvitationStatus = 'pending' | 'expired' | 'accepted';

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

@Injectable()
export class InvitationsService {
  private readonly perHousehold: LimitRule;
  private readonly perAddress: LimitRule;

  constructor(
    @InjectModel(Invitation) private readonly invitationModel: typeof Invitation,
    private readonly households: HouseholdsService,
    private readonly members: MembersService,
    private readonly students: StudentsService,
    private readonly users: UsersService,
    private readonly passwords: PasswordService,
    private readonly mail: MailService,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly limits: LimitsService,
    config: ConfigService,
  ) {
    const { invitationsPerHouseholdPerHour: hourly, invitationsPerAddressPerDay: daily } =
      config.getOrThrow<AppConfig>('app').limits;
    this.perHousehold = {
      name: 'invitations-household',
      limit: hourly,
      windowMs: 3_600_000,
      message: `This household has sent ${hourly} invitations in the last hour: please wait a while before sending more`,
    };
    this.perAddress = {
      name: 'invitations-address',
      limit: daily,
      windowMs: DAY_MS,
      message: `That address has had ${daily} invitations today: please wait until tomorrow, or check the address`,
    };
  }

  /** Open (not yet accepted) invitations of the household, newest first. */
  async findAll(member: MemberContext) {
    const rows = await this.invitationModel.findAll({
      where: { householdId: member.householdId, acceptedAt: null },
      include: [{ model: User, attributes: ['id', 'displayName'] }],
      order: [['id', 'DESC']],
    });
    const items = rows.map(toInvitationJson);
    return { items, total: items.length };
  }

  async create(
    member: MemberContext,
    inviter: SessionUser,
    dto: CreateInvitationDto,
    origin: string,
  ) {
    const email = normalizeEmail(dto.email);
    const studentIds = [...new Set(dto.studentIds ?? [])];
    if (dto.role === Role.tutor) await this.members.assertStudents(member, studentIds);
    else if (studentIds.length > 0) throw fieldsError({ studentIds: ONLY_TUTORS_GET_STUDENTS });
    if (await this.members.isMember(member.householdId, email)) {
      throw new ConflictException({
        message: 'That person is already a member of this household',
        fields: { email: 'is already a member of this household' },
      });
    }
    await this.limits.take(this.perAddress, email);
    await this.limits.take(this.perHousehold, String(member.householdId));
    const household = await this.households.findCurrent(member);
    const { token, hash } = newLinkToken();
    const invitation = await this.invitationModel.create({
      householdId: member.householdId,
      email,
      role: dto.role,
      studentIds,
      tokenHash: hash,
      invitedById: inviter.id,
      expiresAt: new Date(Date.now() + INVITATION_DAYS * DAY_MS),
    });
    try {
      await this.mail.send(
        invitationLetter({
          to: email,
          inviter: inviter.displayName,
          household: household.name,
          role: dto.role,
          students: studentIds.length,
          expiresAt: invitation.expiresAt,
          url: `${origin}/invitations/${token}`,
        }),
      );
    } catch (err) {
      await invitation.destroy();
      throw err;
    }
    // A fresh invitation replaces any earlier open one to the same address.
    await this.invitationModel.destroy({
      where: {
        householdId: member.householdId,
        email,
        acceptedAt: null,
        id: { [Op.ne]: invitation.id },
      },
    });
    invitation.invitedBy = await this.users.findById(inviter.id);
    return toInvitationJson(invitation);
  }

  /** Withdraws an invitation not yet accepted; its link stops working at once. */
  async remove(member: MemberContext, id: number): Promise<void> {
    const invitation = await this.invitationModel.findOne({
      where: { id, householdId: member.householdId },
    });
    if (!invitation) throw new NotFoundException(`No invitation ${id} in this household`);
    if (invitation.acceptedAt) {
      throw new ConflictException(
        'That invitation was accepted: remove the member on the Members page instead',
      );
    }
    await invitation.destroy();
  }

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

export function statusOf(invitation: Invitation, now = Date.now()): InvitationStatus {
  if (invitation.acceptedAt) return 'accepted';
  return invitation.expiresAt.getTime() <= now ? 'expired' : 'pending';
}

export function toInvitationJson(invitation: Invitation) {
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    studentIds: invitation.studentIds,
    invitedBy: invitation.invitedBy
      ? { id: invitation.invitedBy.id, displayName: invitation.invitedBy.displayName }
      : null,
    status: statusOf(invitation),
    expiresAt: invitation.expiresAt,
    createdAt: invitation.createdAt,
  };
}

function invitationLetter(o: {
  to: string;
  inviter: string;
  household: string;
  role: Role;
  students: number;
  expiresAt: Date;
  url: string;
}) {
  const sees =
    o.role === Role.tutor
      ? ` As a tutor you will see the work of the ${o.students === 1 ? 'student' : `${o.students} students`} they chose, add notes and build review plans.`
      : ' As a parent you will see and edit everything in the household.';
  return {
    to: o.to,
    subject: `${o.inviter} invited you to ${o.household} on Workback`,
    paragraphs: [
      'Hello,',
      `${o.inviter} has invited you to join ${o.household} on Workback as a ${o.role}.${sees}`,
      'Workback is a notebook for families who teach math at home: it keeps the missed problems, the child’s own explanation, and what to review next.',
      `The link works once and expires on ${o.expiresAt.toUTCString()}. If you already have a Workback account, sign in first, then open the link.`,
    ],
    action: { label: 'Accept the invitation', url: o.url },
    sentBy: `${o.inviter}, of ${o.household}`,
    reason: `because ${o.inviter} entered this address to invite you. If you did not expect it, ignore it: nothing happens unless the link is opened`,
  };
}
