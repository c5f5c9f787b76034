import { Injectable, NotFoundException, UnprocessableEntityException } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { buildReviewPlan, MissStatus } from '@workback/core';
import { Op, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { lockRow } from '../database/row-lock.js';
import { MissesService } from '../misses/misses.service.js';
import { StudentMissesService } from '../misses/student-misses.service.js';
import { Student } from '../students/models/student.model.js';
import { StudentsService } from '../students/students.service.js';
import type { CreateReviewPlanDto } from './dto/create-review-plan.dto.js';
import { ReviewPlanItemMiss } from './models/review-plan-item-miss.model.js';
import { ReviewPlanItem } from './models/review-plan-item.model.js';
import { ReviewPlan } from './models/review-plan.model.js';
import { toPlanMiss, type MissWithDiagnosis } from './plan-miss.js';
import { ReviewPlansService } from './review-plans.service.js';

const OPEN: MissStatus[] = [MissStatus.logged, MissStatus.discussed];

/** A review plan made: the misses chosen, core's buildReviewPlan, the rows, the misses planned. */
@Injectable()
export class ReviewPlanMakingService {
  constructor(
    @InjectModel(ReviewPlan) private readonly planModel: typeof ReviewPlan,
    @InjectModel(ReviewPlanItem) private readonly itemModel: typeof ReviewPlanItem,
    @InjectModel(ReviewPlanItemMiss) private readonly linkModel: typeof ReviewPlanItemMiss,
    @InjectModel(Student) private readonly studentModel: typeof Student,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly students: StudentsService,
    private readonly misses: MissesService,
    private readonly studentMisses: StudentMissesService,
    private readonly plans: ReviewPlansService,
  ) {}

  /**
   * Builds and saves a plan in one transaction: the plan row first (its id seeds the
   * practice problems), then the checklist and its links, then the misses move to planned.
   * The student's row is locked first, so two plans asked for at once are made in turn and the
   * second reads the first's plan and planned misses (without missIds: 422, none left open).
   */
  async create(member: MemberContext, dto: CreateReviewPlanDto) {
    const student = await this.students.find(member, dto.studentId);
    const id = await this.sequelize.transaction(async (transaction) => {
      const locked = await lockRow(this.studentModel, student.id, transaction);
      if (locked === null)
        throw new NotFoundException(`No student ${student.id} in this household`);
      const chosen = await this.chooseMisses(member, student.id, dto.missIds, transaction);
      const plan = await this.planModel.create(
        {
          householdId: member.householdId,
          studentId: student.id,
          scheduledFor: dto.scheduledFor,
          status: 'open',
          covers: [],
          lessonsText: '',
          notes: [],
          createdBy: member.userId,
        },
        { transaction },
      );
      const draft = buildReviewPlan(chosen.map(toPlanMiss), {
        planId: plan.id,
        lessonTitles: await this.plans.lessonTitlesFor(member, chosen, transaction),
      });
      if (draft.items.length === 0)
        throw fieldsError({
          missIds: 'every chosen miss is right by the checker: there is nothing to re-work',
        });
      await plan.update(
        { covers: draft.covers, lessonsText: draft.lessons.text, notes: draft.notes },
        { transaction },
      );
      const items = await this.itemModel.bulkCreate(
        draft.items.map((item, position) => ({
          planId: plan.id,
          position,
          kind: item.kind,
          key: item.key,
          title: item.title.slice(0, 300),
          payload: item.payload,
          done: false,
        })),
        { transaction },
      );
      await this.linkModel.bulkCreate(
        draft.items.flatMap((item, i) =>
          item.missIds.map((missId) => ({ itemId: items[i]!.id, missId })),
        ),
        { transaction },
      );
      const leftOut = new Set(draft.leftOut);
      await this.misses.setStatus(
        member,
        chosen.filter((m) => !leftOut.has(m.id)).map((m) => m.id),
        MissStatus.planned,
        transaction,
      );
      return plan.id;
    });
    return this.plans.findOne(member, id);
  }

  private async chooseMisses(
    member: MemberContext,
    studentId: number,
    missIds: readonly number[] | undefined,
    transaction: Transaction,
  ): Promise<MissWithDiagnosis[]> {
    if (missIds !== undefined) {
      const found = await this.studentMisses.withDiagnoses(
        member,
        { studentId, ids: missIds },
        transaction,
      );
      const have = new Set(found.map((m) => m.id));
      const errors: Record<string, string> = {};
      for (const [index, missId] of missIds.entries()) {
        if (have.has(missId)) continue;
        // Not the member's to see at all: 404. Theirs, but another student's: name the field.
        await this.misses.findModel(member, missId, transaction);
        errors[`missIds.${index}`] = `miss ${missId} is another student’s`;
      }
      if (Object.keys(errors).length) throw fieldsError(errors);
      return found;
    }
    const last = await this.planModel.findOne({
      where: { [Op.and]: [this.plans.scope(member), { studentId }] },
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
      transaction,
    });
    const onLast = last ? await this.missIdsOf(last.id, transaction) : new Set<number>();
    const open = (
      await this.studentMisses.withDiagnoses(member, { studentId, statuses: OPEN }, transaction)
    ).filter((m) => !onLast.has(m.id));
    if (open.length === 0)
      throw new UnprocessableEntityException(
        'There are no open misses since the last plan: choose the misses to review with missIds',
      );
    return open;
  }

  private async missIdsOf(planId: number, transaction?: Transaction): Promise<Set<number>> {
    const items = await this.itemModel.findAll({
      where: { planId },
      attributes: ['id'],
      transaction,
    });
    const links = await this.plans.linksOf(
      items.map((i) => i.id),
      transaction,
    );
    return new Set([...links.values()].flat());
  }
}
