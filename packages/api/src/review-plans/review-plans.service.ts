import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import {
  chooseFocus,
  lessonTitle,
  MissStatus,
  type FactFamilyDrill,
  type LessonRange,
  type PracticeBlock,
  type ReviewedPlan,
} from '@workback/core';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { addToList } from '../common/add-to-list.js';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import {
  driverBoolean,
  driverDate,
  placeholders,
  selectList,
  SqlReader,
} from '../database/sql-reader.js';
import { jsonOf } from '../misses/miss-json.js';
import { AnswerKeysService } from '../answer-keys/answer-keys.service.js';
import { CurriculumService } from '../curriculum/curriculum.service.js';
import { MissesService } from '../misses/misses.service.js';
import { StudentMissesService } from '../misses/student-misses.service.js';
import { StudentsService } from '../students/students.service.js';
import type { ListReviewPlansQuery } from './dto/list-review-plans.query.js';
import type { UpdateReviewPlanDto } from './dto/update-review-plan.dto.js';
import { ReviewPlanItem } from './models/review-plan-item.model.js';
import { ReviewPlan } from './models/review-plan.model.js';
import { toPlanMiss } from './plan-miss.js';
import { sameDayWarning, toPlanMissJson, toPlanSummary } from './review-plan-json.js';

const PLAN_FIELDS = [
  'id',
  'studentId',
  'scheduledFor',
  'status',
  'covers',
  'lessonsText',
  'notes',
  'createdBy',
  'createdAt',
  'updatedAt',
] as const satisfies readonly (keyof ReviewPlan)[];
type PlanRow = Pick<ReviewPlan, (typeof PLAN_FIELDS)[number]>;
const PLAN_COLUMNS = selectList(ReviewPlan, PLAN_FIELDS);

const ITEM_FIELDS = [
  'id',
  'position',
  'kind',
  'key',
  'title',
  'payload',
  'done',
  'doneAt',
  'doneBy',
] as const satisfies readonly (keyof ReviewPlanItem)[];
const ITEM_COLUMNS = selectList(ReviewPlanItem, ITEM_FIELDS);

/** A checklist item's raw row as the model reads it. */
function itemOf(row: Record<string, unknown>): Pick<ReviewPlanItem, (typeof ITEM_FIELDS)[number]> {
  return {
    ...(row as unknown as Pick<ReviewPlanItem, (typeof ITEM_FIELDS)[number]>),
    payload: jsonOf<ReviewPlanItem['payload']>(row.payload, null as never),
    done: driverBoolean(row.done) ?? false,
    doneAt: row.doneAt === null || row.doneAt === undefined ? null : driverDate(row.doneAt),
  };
}

/** Review plans read (list, one plan with its checklist, coverage for patterns) and checked off. */
@Injectable()
export class ReviewPlansService {
  constructor(
    @InjectModel(ReviewPlan) private readonly planModel: typeof ReviewPlan,
    @InjectModel(ReviewPlanItem) private readonly itemModel: typeof ReviewPlanItem,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly reader: SqlReader,
    private readonly students: StudentsService,
    private readonly misses: MissesService,
    private readonly studentMisses: StudentMissesService,
    private readonly keys: AnswerKeysService,
    private readonly curriculum: CurriculumService,
  ) {}

  /** Lesson titles from the courses of the misses' keys (or the household's only course). */
  async lessonTitlesFor(
    member: MemberContext,
    misses: readonly { keyItemId: number | null }[],
    transaction?: Transaction,
  ) {
    const itemIds = misses.flatMap((m) => (m.keyItemId === null ? [] : [m.keyItemId]));
    const courses = await this.keys.coursesOfItems(member, itemIds, transaction);
    return this.curriculum.lessonTitles(member, courses, transaction);
  }

  /** The plans a member may see: the household's, and for a tutor the granted students'. */
  scope(member: MemberContext): WhereOptions<ReviewPlan> {
    return member.studentIds === null
      ? { householdId: member.householdId }
      : { householdId: member.householdId, studentId: { [Op.in]: member.studentIds } };
  }

  async findAll(member: MemberContext, query: ListReviewPlansQuery) {
    if (query.studentId !== undefined) await this.students.find(member, query.studentId);
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 25;
    const where: WhereOptions<ReviewPlan> = {
      [Op.and]: [
        this.scope(member),
        ...(query.studentId !== undefined ? [{ studentId: query.studentId }] : []),
      ],
    };
    const { rows, count } = await this.planModel.findAndCountAll({
      where,
      order: [
        ['scheduledFor', 'DESC'],
        ['id', 'DESC'],
      ],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    });
    const items = await this.itemModel.findAll({
      where: { planId: { [Op.in]: rows.map((p) => p.id) } },
      attributes: ['id', 'planId', 'done'],
    });
    const links = await this.linksOf(items.map((i) => i.id));
    return {
      items: rows.map((p) => {
        const own = items.filter((i) => i.planId === p.id);
        return {
          ...toPlanSummary(p),
          progress: { done: own.filter((i) => i.done).length, total: own.length },
          missCount: new Set(own.flatMap((i) => links.get(i.id) ?? [])).size,
        };
      }),
      total: count,
      page,
      pageSize,
    };
  }

  async findOne(member: MemberContext, id: number) {
    // Plain rows through the driver (SqlReader): every view, print and export of a plan reads it.
    const plan = await this.planRow(member, id);
    // Sent together: each read otherwise waits for the one before it and then for its own turn
    // of the event loop, which with many families at once was most of a print's time.
    const [student, itemRows, links] = await Promise.all([
      this.students.find(member, plan.studentId),
      this.reader.rows<Record<string, unknown>>(
        `SELECT ${ITEM_COLUMNS()} FROM "review_plan_items" WHERE "plan_id" = ? ORDER BY "position"`,
        [plan.id],
      ),
      this.linksOfPlan(plan.id),
    ]);
    const items = itemRows.map(itemOf);
    const missIds = [...new Set(items.flatMap((i) => links.get(i.id) ?? []))];
    const misses =
      missIds.length === 0
        ? []
        : await this.studentMisses.withDiagnoses(member, {
            studentId: plan.studentId,
            ids: missIds,
          });
    // Lessons carry the curriculum's current titles (a renamed lesson reads as renamed).
    const titles = await this.lessonTitlesFor(member, misses);
    const titled = new Map<number, { title: string; payload: LessonRange }>();
    for (const i of items.filter((x) => x.kind === 'lesson')) {
      const r = i.payload as unknown as LessonRange;
      const payload: LessonRange = {
        ...r,
        lessons: Array.from({ length: r.to - r.from + 1 }, (_, k) => ({
          number: r.from + k,
          title: titles[r.from + k] ?? null,
        })),
      };
      titled.set(i.id, { title: lessonTitle(payload), payload });
    }
    const payloads = <T>(kind: string) =>
      items.filter((i) => i.kind === kind).map((i) => i.payload as unknown as T);
    const ranges = items.flatMap((i) => titled.get(i.id)?.payload ?? []);
    const factFamilies = payloads<FactFamilyDrill>('fact-family');
    return {
      ...toPlanSummary(plan),
      student: { id: student.id, name: student.name, gradeLevel: student.gradeLevel },
      lessons: { text: plan.lessonsText, ranges },
      factFamilies,
      practice: payloads<PracticeBlock>('practice'),
      misses: misses.map(toPlanMissJson),
      summary: {
        lessons: [...titled.values()].map((t) => t.title),
        facts: factFamilies.map((f) => `${f.label}: ${f.facts.join(', ')}`),
        focus: chooseFocus(misses.map(toPlanMiss)),
      },
      items: items.map((i) => ({
        id: i.id,
        position: i.position,
        kind: i.kind,
        key: i.key,
        title: titled.get(i.id)?.title ?? i.title,
        payload: titled.get(i.id)?.payload ?? i.payload,
        done: i.done,
        doneAt: i.doneAt,
        doneBy: i.doneBy,
        missIds: links.get(i.id) ?? [],
      })),
      progress: { done: items.filter((i) => i.done).length, total: items.length },
      covers: plan.covers,
      notes: plan.notes,
      warning: sameDayWarning(plan.scheduledFor, misses),
    };
  }

  /** The plan as a plain row, to read; 404 as findModel. */
  private async planRow(member: MemberContext, id: number): Promise<PlanRow> {
    const granted = member.studentIds;
    const [row] =
      granted !== null && granted.length === 0
        ? []
        : await this.reader.rows<Record<string, unknown>>(
            `SELECT ${PLAN_COLUMNS()} FROM "review_plans" WHERE "id" = ? AND "household_id" = ?` +
              (granted === null ? '' : ` AND "student_id" IN (${placeholders(granted.length)})`),
            [id, member.householdId, ...(granted ?? [])],
          );
    if (!row) throw new NotFoundException(`No review plan ${id} in this household`);
    return {
      ...(row as unknown as PlanRow),
      covers: jsonOf<string[]>(row.covers, []),
      notes: jsonOf<string[]>(row.notes, []),
      createdAt: driverDate(row.createdAt),
      updatedAt: driverDate(row.updatedAt),
    };
  }

  /** 404 both for what does not exist and for a plan of a student the member may not see. */
  async findModel(member: MemberContext, id: number, transaction?: Transaction) {
    const plan = await this.planModel.findOne({
      where: { [Op.and]: [this.scope(member), { id }] },
      transaction,
    });
    if (!plan) throw new NotFoundException(`No review plan ${id} in this household`);
    return plan;
  }

  /**
   * Checks items off (or back on) and moves the misses they cover: a miss whose every item
   * on this plan is done becomes resolved; one that was resolved goes back to planned when
   * one of its items is unchecked.
   */
  async update(member: MemberContext, id: number, dto: UpdateReviewPlanDto) {
    if (dto.scheduledFor === undefined && dto.items === undefined)
      throw fieldsError({ items: 'send items to check off, or a new scheduledFor' });
    await this.sequelize.transaction(async (transaction) => {
      const plan = await this.findModel(member, id, transaction);
      const items = await this.itemModel.findAll({ where: { planId: plan.id }, transaction });
      const byId = new Map(items.map((i) => [i.id, i]));
      const errors: Record<string, string> = {};
      const seen = new Set<number>();
      (dto.items ?? []).forEach((c, index) => {
        if (!byId.has(c.id)) errors[`items.${index}.id`] = `item ${c.id} is not on this plan`;
        else if (seen.has(c.id)) errors[`items.${index}.id`] = `item ${c.id} is listed twice`;
        seen.add(c.id);
      });
      if (Object.keys(errors).length) throw fieldsError(errors);
      const changed: number[] = [];
      for (const c of dto.items ?? []) {
        const item = byId.get(c.id)!;
        if (item.done === c.done) continue;
        await item.update(
          {
            done: c.done,
            doneAt: c.done ? new Date() : null,
            doneBy: c.done ? member.userId : null,
          },
          { transaction },
        );
        changed.push(item.id);
      }
      if (changed.length > 0) {
        const links = await this.linksOf(
          items.map((i) => i.id),
          transaction,
        );
        const touched = new Set(changed.flatMap((i) => links.get(i) ?? []));
        const resolved: number[] = [];
        const reopened: number[] = [];
        for (const missId of touched) {
          const covering = items.filter((i) => (links.get(i.id) ?? []).includes(missId));
          (covering.every((i) => i.done) ? resolved : reopened).push(missId);
        }
        if (resolved.length)
          await this.misses.setStatus(member, resolved, MissStatus.resolved, transaction);
        if (reopened.length) {
          const wasResolved = await this.studentMisses.withDiagnoses(
            member,
            { studentId: plan.studentId, ids: reopened, statuses: [MissStatus.resolved] },
            transaction,
          );
          await this.misses.setStatus(
            member,
            wasResolved.map((m) => m.id),
            MissStatus.planned,
            transaction,
          );
        }
      }
      await plan.update(
        {
          ...(dto.scheduledFor !== undefined ? { scheduledFor: dto.scheduledFor } : {}),
          status: items.length > 0 && items.every((i) => i.done) ? 'done' : 'open',
        },
        { transaction },
      );
    });
    return this.findOne(member, id);
  }

  /** For patterns: each plan of the student with its day and the pattern keys it covered. */
  async coverage(member: MemberContext, studentId: number): Promise<ReviewedPlan[]> {
    if (member.studentIds !== null && !member.studentIds.includes(studentId)) return [];
    const plans = await this.reader.rows<{ id: number; scheduledFor: string; covers: unknown }>(
      `SELECT "id", "scheduled_for" AS "scheduledFor", "covers" FROM "review_plans"
       WHERE "household_id" = ? AND "student_id" = ?`,
      [member.householdId, studentId],
    );
    return plans.map((p) => ({
      id: p.id,
      scheduledFor: p.scheduledFor,
      covers: jsonOf<string[]>(p.covers, []),
    }));
  }

  /** linksOf for every item of one plan, read without waiting for the items. */
  private async linksOfPlan(planId: number): Promise<Map<number, number[]>> {
    const rows = await this.reader.rows<{ itemId: number; missId: number }>(
      `SELECT "item_id" AS "itemId", "miss_id" AS "missId" FROM "review_plan_item_misses"
       WHERE "item_id" IN (SELECT "id" FROM "review_plan_items" WHERE "plan_id" = ?)
       ORDER BY "miss_id"`,
      [planId],
    );
    return linkMap(rows);
  }

  /** The misses each checklist item covers, by item id. */
  async linksOf(
    itemIds: readonly number[],
    transaction?: Transaction,
  ): Promise<Map<number, number[]>> {
    if (itemIds.length === 0) return new Map();
    const rows = await this.reader.rows<{ itemId: number; missId: number }>(
      `SELECT "item_id" AS "itemId", "miss_id" AS "missId" FROM "review_plan_item_misses"
       WHERE "item_id" IN (${placeholders(itemIds.length)}) ORDER BY "miss_id"`,
      itemIds,
      transaction,
    );
    return linkMap(rows);
  }
}

/** Each item's misses, in the order read. */
function linkMap(rows: readonly { itemId: number; missId: number }[]): Map<number, number[]> {
  const map = new Map<number, number[]>();
  for (const r of rows) addToList(map, r.itemId, r.missId);
  return map;
}

export type ReviewPlanJson = Awaited<ReturnType<ReviewPlansService['findOne']>>;
