import {
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
} from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { Role } from '@workback/core';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { lockRow } from '../database/row-lock.js';
import { StudentsService } from '../students/students.service.js';
import { User } from '../users/models/user.model.js';
import { normalizeEmail } from '../users/users.service.js';
import type { UpdateMemberDto } from './dto/update-member.dto.js';
import { Membership } from './models/membership.model.js';
import { StudentGrant } from './models/student-grant.model.js';

export interface MemberJson {
  id: number;
  userId: number;
  displayName: string;
  email: string;
  role: Role;
  /** A tutor's granted students; null for owners and parents, who see every student. */
  studentIds: number[] | null;
  joinedAt: Date;
  isYou: boolean;
}

export const TUTOR_NEEDS_STUDENTS = 'a tutor must be given at least one student of this household';
export const ONLY_TUTORS_GET_STUDENTS =
  'only a tutor is given students; owners and parents see every student';

/** The household's members: who they are, their role, a tutor's students. Owners and parents only. */
@Injectable()
export class MembersService {
  constructor(
    @InjectModel(Membership) private readonly membershipModel: typeof Membership,
    @InjectModel(StudentGrant) private readonly grantModel: typeof StudentGrant,
    private readonly students: StudentsService,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  async findAll(member: MemberContext) {
    const rows = await this.membershipModel.findAll({
      where: { householdId: member.householdId },
      include: [User],
      order: [['id', 'ASC']],
    });
    const items = await Promise.all(rows.map((m) => this.toJson(member, m)));
    return { items, total: items.length };
  }

  async findOne(member: MemberContext, id: number): Promise<MemberJson> {
    return this.toJson(member, await this.findModel(member, id));
  }

  async update(member: MemberContext, id: number, dto: UpdateMemberDto): Promise<MemberJson> {
    if (dto.role === undefined && dto.studentIds === undefined) {
      throw fieldsError({ role: 'send a new role, or studentIds for a tutor' });
    }
    const target = await this.findModel(member, id);
    this.assertMayManage(member, target);
    if (dto.role === Role.owner && member.role !== Role.owner) {
      throw new ForbiddenException('Only an owner may make someone an owner');
    }
    const role = dto.role ?? target.role;
    if (target.role === Role.owner && role !== Role.owner) await this.assertNotLastOwner(member);

    let studentIds: number[] | undefined;
    if (role === Role.tutor) {
      studentIds = dto.studentIds ?? (target.role === Role.tutor ? undefined : []);
      if (studentIds !== undefined) await this.assertStudents(member, studentIds);
    } else if (dto.studentIds !== undefined) {
      throw fieldsError({ studentIds: ONLY_TUTORS_GET_STUDENTS });
    }

    await this.sequelize.transaction(async (transaction) => {
      // The membership's row first, as the UPDATE below sends nothing when the role is unchanged:
      // two changes of a tutor's students at once then go in turn, and the second deletes the
      // grants the first inserted (on PostgreSQL their primary key refused the second's, 409).
      const locked = await lockRow(this.membershipModel, target.id, transaction);
      if (!locked) throw new NotFoundException(`No member ${id} in this household`);
      await target.update({ role }, { transaction });
      if (role !== Role.tutor || studentIds !== undefined) {
        await this.grantModel.destroy({ where: { membershipId: target.id }, transaction });
      }
      if (role === Role.tutor && studentIds !== undefined) {
        await this.grantModel.bulkCreate(
          [...new Set(studentIds)].map((studentId) => ({ membershipId: target.id, studentId })),
          { transaction },
        );
      }
    });
    return this.findOne(member, id);
  }

  /** Takes effect on the member's next request: the destroy empties MemberCache. */
  async remove(member: MemberContext, id: number): Promise<void> {
    const target = await this.findModel(member, id);
    this.assertMayManage(member, target);
    if (target.role === Role.owner) await this.assertNotLastOwner(member);
    await target.destroy();
  }

  /** Every id must be a student of this household (404 otherwise), and a tutor needs one. */
  async assertStudents(member: MemberContext, studentIds: readonly number[]): Promise<void> {
    if (studentIds.length === 0) throw fieldsError({ studentIds: TUTOR_NEEDS_STUDENTS });
    for (const studentId of new Set(studentIds)) await this.students.find(member, studentId);
  }

  async isMember(householdId: number, email: string): Promise<boolean> {
    const count = await this.membershipModel.count({
      where: { householdId },
      include: [{ model: User, where: { email: normalizeEmail(email) }, required: true }],
    });
    return count > 0;
  }

  private async findModel(member: MemberContext, id: number): Promise<Membership> {
    const membership = await this.membershipModel.findOne({
      where: { id, householdId: member.householdId },
      include: [User],
    });
    if (!membership) throw new NotFoundException(`No member ${id} in this household`);
    return membership;
  }

  private assertMayManage(member: MemberContext, target: Membership): void {
    if (target.role === Role.owner && member.role !== Role.owner) {
      throw new ForbiddenException('A parent may not change or remove the owner');
    }
  }

  private async assertNotLastOwner(member: MemberContext): Promise<void> {
    const owners = await this.membershipModel.count({
      where: { householdId: member.householdId, role: Role.owner },
    });
    if (owners <= 1) {
      throw new ConflictException('The household needs an owner: make another member owner first');
    }
  }

  private async toJson(member: MemberContext, m: Membership): Promise<MemberJson> {
    let studentIds: number[] | null = null;
    if (m.role === Role.tutor) {
      const grants = await this.grantModel.findAll({
        where: { membershipId: m.id },
        order: [['studentId', 'ASC']],
      });
      studentIds = grants.map((g) => g.studentId);
    }
    return {
      id: m.id,
      userId: m.userId,
      displayName: m.user!.displayName,
      email: m.user!.email,
      role: m.role,
      studentIds,
      joinedAt: m.createdAt,
      isYou: m.userId === member.userId,
    };
  }
}
