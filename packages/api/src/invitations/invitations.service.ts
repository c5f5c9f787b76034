import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectModel } from '@nestjs/sequelize';
import { Role } from '@workback/core';
import { Op } from 'sequelize';
import { type LimitRule, LimitsService } from '../common/limits/limits.service.js';
import type { MemberContext, SessionUser } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { newLinkToken } from '../common/tokens.js';
import { HouseholdsService } from '../households/households.service.js';
import { MembersService, ONLY_TUTORS_GET_STUDENTS } from '../households/members.service.js';
import { MailService } from '../mail/mail.service.js';
import type { AppConfig } from '../config/app.config.js';
import { User } from '../users/models/user.model.js';
import { normalizeEmail, UsersService } from '../users/users.service.js';
import type { CreateInvitationDto } from './dto/create-invitation.dto.js';
import { Invitation } from './models/invitation.model.js';

export const INVITATION_DAYS = 7;
const DAY_MS = 86_400_000;

export type InvitationStatus = 'pending' | 'expired' | 'accepted';

/** Invitations a household sends: listed, sent by mail (within limits), withdrawn. */
@Injectable()
export class InvitationsService {
  private readonly perHousehold: LimitRule;
  private readonly perAddress: LimitRule;

  constructor(
    @InjectModel(Invitation) private readonly invitationModel: typeof Invitation,
    private readonly households: HouseholdsService,
    private readonly members: MembersService,
    private readonly users: UsersService,
    private readonly mail: MailService,
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
    // A fresh invitation replaces any earlier open one to the same address. Only earlier ones:
    // of two sent at once, each removing the other's would leave neither mailed link working.
    await this.invitationModel.destroy({
      where: {
        householdId: member.householdId,
        email,
        acceptedAt: null,
        id: { [Op.lt]: invitation.id },
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
