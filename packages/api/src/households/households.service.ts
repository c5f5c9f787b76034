import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Role } from '@workback/core';
import type { Transaction } from 'sequelize';
import type { MemberContext } from '../common/member-context.js';
import { type CachedMembership, MemberCache } from './member-cache.js';
import { Household } from './models/household.model.js';
import { Membership } from './models/membership.model.js';
import { StudentGrant } from './models/student-grant.model.js';

export interface HouseholdSummary {
  id: number;
  name: string;
  role: Role;
}

@Injectable()
export class HouseholdsService {
  constructor(
    @InjectModel(Household) private readonly householdModel: typeof Household,
    @InjectModel(Membership) private readonly membershipModel: typeof Membership,
    @InjectModel(StudentGrant) private readonly grantModel: typeof StudentGrant,
    private readonly cache: MemberCache,
  ) {}

  /**
   * The membership a request acts under: the session's household if still a member, else the
   * first. Read through MemberCache, which forgets a user's memberships when any change.
   */
  async resolveMember(
    userId: number,
    preferredHouseholdId?: number,
  ): Promise<MemberContext | null> {
    const memberships = await this.cache.membershipsOf(userId, () => this.loadMemberships(userId));
    const membership =
      memberships.find((m) => m.householdId === preferredHouseholdId) ?? memberships[0];
    if (!membership) return null;
    return {
      userId,
      membershipId: membership.id,
      householdId: membership.householdId,
      role: membership.role,
      studentIds: membership.studentIds,
    };
  }

  /** Every membership of the user, oldest first, with a tutor's granted students: one query. */
  private async loadMemberships(userId: number): Promise<CachedMembership[]> {
    const rows = await this.membershipModel.findAll({
      attributes: ['id', 'householdId', 'role'],
      where: { userId },
      order: [['id', 'ASC']],
      raw: true,
    });
    const tutors = rows.filter((m) => m.role === Role.tutor).map((m) => m.id);
    const grants = tutors.length
      ? await this.grantModel.findAll({
          attributes: ['membershipId', 'studentId'],
          where: { membershipId: tutors },
          raw: true,
        })
      : [];
    return rows.map((m) => ({
      id: m.id,
      householdId: m.householdId,
      role: m.role,
      studentIds:
        m.role === Role.tutor
          ? grants.filter((g) => g.membershipId === m.id).map((g) => g.studentId)
          : null,
    }));
  }

  async listForUser(userId: number): Promise<HouseholdSummary[]> {
    const memberships = await this.membershipModel.findAll({
      where: { userId },
      include: [Household],
      order: [['id', 'ASC']],
    });
    return memberships.map((m) => ({ id: m.householdId, name: m.household!.name, role: m.role }));
  }

  /** The user's membership of that household, or 404 (not there and not yours look the same). */
  async findMembershipOf(userId: number, householdId: number): Promise<Membership> {
    const membership = await this.membershipModel.findOne({ where: { userId, householdId } });
    if (!membership) throw new NotFoundException(`No household ${householdId} of yours`);
    return membership;
  }

  async findCurrent(member: MemberContext) {
    const household = await this.householdModel.findByPk(member.householdId, {
      rejectOnEmpty: true,
    });
    return {
      id: household.id,
      name: household.name,
      role: member.role,
      createdAt: household.createdAt,
    };
  }

  async createWithOwner(
    name: string,
    ownerId: number,
    transaction: Transaction,
  ): Promise<Household> {
    const household = await this.householdModel.create({ name }, { transaction });
    await this.membershipModel.create(
      { householdId: household.id, userId: ownerId, role: Role.owner },
      { transaction },
    );
    return household;
  }

  async addMember(
    householdId: number,
    userId: number,
    role: Role,
    studentIds: readonly number[],
    transaction?: Transaction,
  ): Promise<Membership> {
    const membership = await this.membershipModel.create(
      { householdId, userId, role },
      { transaction },
    );
    if (role === Role.tutor && studentIds.length > 0) {
      await this.grantModel.bulkCreate(
        studentIds.map((studentId) => ({ membershipId: membership.id, studentId })),
        { transaction },
      );
    }
    return membership;
  }
}
