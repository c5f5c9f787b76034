import { Injectable, NotFoundException, UnprocessableEntityException } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import {
  buildReviewPlan,
  chooseFocus,
  formatTrace,
  lessonTitle,
  lineVerdict,
  ruleName,
  MissStatus,
  type FactFamilyDrill,
  type LessonRange,
  type PracticeBlock,
  type ReviewedPlan,
} from '@workback/core';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { AnswerKeysService } from '../answer-keys/answer-keys.service.js';
import { CurriculumService } from '../curriculum/curriculum.service.js';
import { MissesService } from '../misses/misses.service.js';
import { StudentsService } from '../students/students.service.js';
import type { CreateReviewPlanDto } from './dto/create-review-plan.dto.js';
import type { ListReviewPlansQuery } from './dto/list-review-plans.query.js';
import type { UpdateReviewPlanDto } from './dto/update-review-plan.dto.js';
import { ReviewPlanItemMiss } from './models/review-plan-item-miss.model.js';
import { ReviewPlanItem } from './models/review-plan-item.model.js';
import { ReviewPlan } from './models/review-plan.model.js';
import { toPlanMiss, type MissWithDiagnosis } from './plan-miss.js';

export const SAME_DAY_WARNING =
  'The review falls on the same day as work it reviews; review works better on a calmer, separate day.';

const OPEN: MissStatus[] = [MissStatus.logged, MissStatus.discussed];

@Injectable()
export class ReviewPlansService {
  constructor(
    @InjectModel(ReviewPlan) private readonly planModel: typeof ReviewPlan,
    @InjectModel(ReviewPlanItem) private readonly itemModel: typeof ReviewPlanItem,
    @InjectModel(ReviewPlanItemMiss) private readonly linkModel: typeof ReviewPlanItemMiss,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly students: StudentsService,
    private readonly misses: MissesService,
    private readonly keys: AnswerKeysService,
    private readonly curriculum: CurriculumService,
  ) {}

  /** Lesson titles from the courses of the misses' keys (or the household's only course). */
  private async lessonTitlesFor(
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

  /**
   * Builds and saves a plan in one transaction: the plan row first (its id seeds the
   * practice problems), then the checklist and its links, then the misses move to planned.
   */
  async create(member: MemberContext, dto: CreateReviewPlanDto) {
    const student = await this.students.findModel(member, dto.studentId);
    const id = await this.sequelize.transaction(async (transaction) => {
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
        lessonTitles: await this.lessonTitlesFor(member, chosen, transaction),
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
    return this.findOne(member, id);
  }

  async findAll(member: MemberContext, query: ListReviewPlansQuery) {
    if (query.studentId !== undefined) await this.students.findModel(member, query.studentId);
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
    const plan = await this.findModel(member, id);
    const student = await this.students.findModel(member, plan.studentId);
    const items = await this.itemModel.findAll({
      where: { planId: plan.id },
      order: [['position', 'ASC']],
    });
    const links = await this.linksOf(items.map((i) => i.id));
    const missIds = [...new Set(items.flatMap((i) => links.get(i.id) ?? []))];
    const misses =
      missIds.length === 0
        ? []
        : await this.misses.withDiagnoses(member, { studentId: plan.studentId, ids: missIds });
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
          const wasResolved = await this.misses.withDiagnoses(
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
    const plans = await this.planModel.findAll({
      where: { [Op.and]: [this.scope(member), { studentId }] },
      attributes: ['id', 'scheduledFor', 'covers'],
    });
    return plans.map((p) => ({ id: p.id, scheduledFor: p.scheduledFor, covers: p.covers }));
  }

  private async chooseMisses(
    member: MemberContext,
    studentId: number,
    missIds: readonly number[] | undefined,
    transaction: Transaction,
  ): Promise<MissWithDiagnosis[]> {
    if (missIds !== undefined) {
      const found = await this.misses.withDiagnoses(
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
      where: { [Op.and]: [this.scope(member), { studentId }] },
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
      transaction,
    });
    const onLast = last ? await this.missIdsOf(last.id, transaction) : new Set<number>();
    const open = (
      await this.misses.withDiagnoses(member, { studentId, statuses: OPEN }, transaction)
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
    const links = await this.linksOf(
      items.map((i) => i.id),
      transaction,
    );
    return new Set([...links.values()].flat());
  }

  private async linksOf(
    itemIds: readonly number[],
    transaction?: Transaction,
  ): Promise<Map<number, number[]>> {
    const map = new Map<number, number[]>();
    if (itemIds.length === 0) return map;
    const rows = await this.linkModel.findAll({
      where: { itemId: { [Op.in]: [...itemIds] } },
      order: [['missId', 'ASC']],
      transaction,
    });
    for (const r of rows) map.set(r.itemId, [...(map.get(r.itemId) ?? []), r.missId]);
    return map;
  }
}

export type ReviewPlanJson = Awaited<ReturnType<ReviewPlansService['findOne']>>;

function toPlanSummary(p: ReviewPlan) {
  return {
    id: p.id,
    studentId: p.studentId,
    scheduledFor: p.scheduledFor,
    status: p.status,
    lessonsText: p.lessonsText,
    createdBy: p.createdBy,
    createdAt: p.createdAt,
    updatedAt: p.updatedAt,
  };
}

/** A miss on a plan, with its working drawn as plain lines for print. */
function toPlanMissJson(m: MissWithDiagnosis) {
  const d = m.diagnosis;
  return {
    id: m.id,
    occurredOn: m.occurredOn,
    problem: m.problem,
    answer: m.answer,
    expected: m.expected,
    explanation: m.explanation,
    cause: m.cause,
    status: m.status,
    ruleIds: m.ruleIds,
    firstWrongStep: d?.firstWrongStep ?? null,
    ruleExplanation: d?.rules[0]?.explanation ?? null,
    ruleName: d?.rules[0] ? ruleName(d.rules[0].id) : null,
    steps: m.steps,
    ...planLines(m),
    writtenSteps: d?.writtenSteps ?? null,
    trace: d ? { expected: d.trace.expected, child: d.trace.child?.working ?? null } : null,
    working: d
      ? {
          expected: formatTrace(d.trace.expected),
          child: d.trace.child ? formatTrace(d.trace.child.working) : null,
        }
      : null,
  };
}

/**
 * A word problem's number sentences as the plan shows, prints and exports them: each line with
 * its verdict (`lineVerdict`), the first wrong line, and the interview stage. Lines saved
 * without a check (the engine failed) are listed as written, without verdicts.
 */
function planLines(m: MissWithDiagnosis) {
  const check = m.linesCheck?.ok ? m.linesCheck : null;
  const lines = check
    ? check.lines.map((l) => ({
        line: l.line,
        text: l.text,
        ok: l.ok as boolean | null,
        written: l.written,
        expected: l.expected as string | null,
        followsFrom: l.followsFrom,
        verdict: lineVerdict(l, check.firstWrongLine) as string | null,
      }))
    : (m.lines ?? []).map((text, i) => ({
        line: i + 1,
        text,
        ok: null,
        written: '',
        expected: null,
        followsFrom: null,
        verdict: null,
      }));
  return {
    lines: lines.length > 0 ? lines : null,
    firstWrongLine: check?.firstWrongLine ?? null,
    stage: m.stage,
  };
}

function sameDayWarning(scheduledFor: string, misses: readonly { occurredOn: string }[]) {
  const dates = [...new Set(misses.map((m) => m.occurredOn))].filter((d) => d === scheduledFor);
  return dates.length === 0
    ? null
    : { code: 'same-day' as const, message: SAME_DAY_WARNING, dates };
}
