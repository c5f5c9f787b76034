import { Injectable, NotFoundException, type OnModuleInit } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { revisitLessons, type Cause } from '@workback/core';
import { AnswerKeysService } from '../answer-keys/answer-keys.service.js';
import type { AnswerChange, RemarkedSitting } from '../answer-keys/key-usage.js';
import { AnswerKey } from '../answer-keys/models/answer-key.model.js';
import type { KeyItem } from '../answer-keys/models/key-item.model.js';
import { checkItem } from '../answer-keys/cross-check.js';
import { sameAnswer as sameAnswerOf } from '../answer-keys/same-answer.js';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { checkCalendarDate } from '../misses/dto/calendar-date.validator.js';
import { MarkedMissesService } from '../misses/marked-misses.service.js';
import { StudentsService } from '../students/students.service.js';
import type { CreateSittingDto } from './dto/create-sitting.dto.js';
import type { ListSittingsQuery, SittingRangeQuery } from './dto/list-sittings.query.js';
import type { PutMarksDto } from './dto/put-marks.dto.js';
import { SittingMark } from './models/sitting-mark.model.js';
import { Sitting } from './models/sitting.model.js';
import { readLocalTime, TIME_OF_DAY_BANDS, timeOfDayOf } from './time-of-day.js';

export interface Tally {
  correct: number;
  marked: number;
}

/** What a mark save or a re-marking did to the sitting's misses. */
export interface MissChanges {
  /** Wrong marks on items whose key answer the checker flags: no miss until the key is checked. */
  heldItemIds: number[];
  createdMissIds: number[];
  reopenedMissIds: number[];
  resolvedMissIds: number[];
  updatedMissIds: number[];
}

const SUMMARY_CAUTION =
  'A handful of sittings is not evidence: scores move with the material as much as with the hour. The best time of day is the family’s call.';

@Injectable()
export class SittingsService implements OnModuleInit {
  constructor(
    @InjectModel(Sitting) private readonly sittingModel: typeof Sitting,
    @InjectModel(SittingMark) private readonly markModel: typeof SittingMark,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly students: StudentsService,
    private readonly keys: AnswerKeysService,
    private readonly misses: MarkedMissesService,
  ) {}

  onModuleInit(): void {
    this.keys.registerUsage({
      sittingCounts: (ids, t, studentIds) => this.sittingCounts(ids, t, studentIds),
      sittingsOf: (ids, studentIds, t) => this.sittingsOf(ids, studentIds, t),
      markCounts: (ids, t) => this.markCounts(ids, t),
      remark: (member, changes, reason, t) => this.remark(member, changes, reason, t),
    });
  }

  /** The sittings a member may see: the household's, and for a tutor the granted students'. */
  scope(member: MemberContext): WhereOptions<Sitting> {
    return member.studentIds === null
      ? { householdId: member.householdId }
      : { householdId: member.householdId, studentId: { [Op.in]: member.studentIds } };
  }

  async findAll(member: MemberContext, query: ListSittingsQuery) {
    if (query.studentId !== undefined) await this.students.findModel(member, query.studentId);
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 50;
    const where = this.listWhere(member, query);
    const dir = query.sort === 'startedAt' ? 'ASC' : 'DESC';
    const [total, rows] = await Promise.all([
      this.sittingModel.count({ where }),
      this.sittingModel.findAll({
        where,
        include: [AnswerKey],
        order: [
          ['startedAt', dir],
          ['id', dir],
        ],
        limit: pageSize,
        offset: (page - 1) * pageSize,
      }),
    ]);
    const tallies = await this.tallies(rows.map((s) => s.id));
    const itemCounts = await this.itemCounts(rows.map((s) => s.answerKeyId));
    const items = rows.map((s) =>
      toSittingSummary(s, tallies.get(s.id), itemCounts.get(s.answerKeyId) ?? 0),
    );
    return { items, total, page, pageSize };
  }

  async findOne(member: MemberContext, id: number, transaction?: Transaction) {
    const sitting = await this.findModel(member, id, transaction);
    const items = await this.keys.itemsOf(sitting.answerKeyId, transaction);
    const marks = await this.markModel.findAll({ where: { sittingId: id }, transaction });
    const misses = await this.misses.findForSitting(id, transaction);
    const byItem = new Map(items.map((i) => [i.id, i]));
    const tally = tallyOf(marks);
    return {
      ...toSittingSummary(sitting, tally, items.length),
      marks: marks
        .map((m) => ({
          id: m.id,
          keyItemId: m.keyItemId,
          number: byItem.get(m.keyItemId)?.number ?? null,
          correct: m.correct,
          answer: m.answer,
          missId: misses.get(m.keyItemId)?.id ?? null,
          // Wrong, but on an item whose key answer the checker flags: no miss until it is checked.
          held:
            !m.correct &&
            !misses.has(m.keyItemId) &&
            byItem.has(m.keyItemId) &&
            keyFlagged(byItem.get(m.keyItemId)!),
        }))
        .sort((a, b) => (a.number ?? 0) - (b.number ?? 0)),
    };
  }

  /** 404 both for what does not exist and for a sitting of a student the member may not see. */
  async findModel(member: MemberContext, id: number, transaction?: Transaction) {
    const sitting = await this.sittingModel.findOne({
      where: { [Op.and]: [this.scope(member), { id }] },
      include: [AnswerKey],
      transaction,
    });
    if (!sitting) throw new NotFoundException(`No sitting ${id} in this household`);
    return sitting;
  }

  async create(member: MemberContext, dto: CreateSittingDto) {
    const startedAt = readLocalTime(dto.startedAt);
    if (startedAt === null) {
      throw fieldsError({
        startedAt:
          'startedAt must be a real local date and time such as 2026-03-02T09:30, without a time zone',
      });
    }
    const future = checkCalendarDate(startedAt.slice(0, 10));
    if (future !== null) throw fieldsError({ startedAt: `startedAt ${future}` });
    await this.students.findModel(member, dto.studentId);
    await this.keys.findKeyModel(member, dto.answerKeyId);
    const sitting = await this.sittingModel.create({
      householdId: member.householdId,
      studentId: dto.studentId,
      answerKeyId: dto.answerKeyId,
      startedAt,
      timeOfDay: timeOfDayOf(startedAt),
      minutes: dto.minutes ?? null,
      rested: dto.conditions?.rested ?? null,
      afterMeal: dto.conditions?.afterMeal ?? null,
      note: dto.conditions?.note || null,
    });
    return this.findOne(member, sitting.id);
  }

  /** Removes a sitting that has no marks yet: undoes a check-up's sitting when its marks could not be saved. */
  async discardUnmarked(member: MemberContext, id: number): Promise<void> {
    const sitting = await this.findModel(member, id);
    if ((await this.markModel.count({ where: { sittingId: id } })) === 0) await sitting.destroy();
  }

  /**
   * Saves every mark of a sitting in one transaction and keeps its misses in step: a wrong
   * item gets a miss, a wrong item turned right resolves it. Saving the same marks twice
   * changes nothing.
   */
  async putMarks(member: MemberContext, id: number, dto: PutMarksDto) {
    return this.sequelize.transaction(async (transaction) => {
      const sitting = await this.findModel(member, id, transaction);
      const items = await this.keys.itemsOf(sitting.answerKeyId, transaction);
      const byId = new Map(items.map((i) => [i.id, i]));
      const errors: Record<string, string> = {};
      const seen = new Map<number, number>();
      dto.marks.forEach((m, index) => {
        if (!byId.has(m.keyItemId)) {
          errors[`marks.${index}.keyItemId`] = `item ${m.keyItemId} is not in this sitting’s key`;
        } else if (seen.has(m.keyItemId)) {
          errors[`marks.${index}.keyItemId`] =
            `item ${byId.get(m.keyItemId)!.number} is marked twice (also marks.${seen.get(m.keyItemId)})`;
        }
        seen.set(m.keyItemId, index);
      });
      if (Object.keys(errors).length) throw fieldsError(errors);

      const existing = new Map(
        (await this.markModel.findAll({ where: { sittingId: id }, transaction })).map((m) => [
          m.keyItemId,
          m,
        ]),
      );
      const changes = emptyChanges();
      const misses = await this.misses.findForSitting(id, transaction);
      const added: Pick<SittingMark, 'sittingId' | 'keyItemId' | 'correct' | 'answer'>[] = [];
      for (const m of dto.marks) {
        const answer = m.answer === undefined || m.answer === '' ? null : m.answer;
        const before = existing.get(m.keyItemId);
        existing.delete(m.keyItemId);
        const item = byId.get(m.keyItemId)!;
        const hold = keyFlagged(item) && m.keyAnswerRight !== true;
        if (before && before.correct === m.correct && before.answer === answer) {
          // The same wrong mark, now with the key's answer said to be right: its miss is made.
          if (!m.correct && !hold && keyFlagged(item) && !misses.has(item.id))
            await this.followMark(
              member,
              sitting,
              item,
              null,
              { correct: false, answer, cause: m.cause ?? undefined },
              '',
              { changes, misses },
              transaction,
            );
          continue;
        }
        const was = before ? { correct: before.correct, answer: before.answer } : null;
        if (before) await before.update({ correct: m.correct, answer }, { transaction });
        else added.push({ sittingId: id, keyItemId: m.keyItemId, correct: m.correct, answer });
        await this.followMark(
          member,
          sitting,
          byId.get(m.keyItemId)!,
          was,
          { correct: m.correct, answer, cause: m.cause ?? undefined },
          'the mark was changed to right',
          { changes, misses, hold },
          transaction,
        );
      }
      if (added.length) await this.markModel.bulkCreate(added, { transaction });
      for (const [itemId, left] of existing) {
        await left.destroy({ transaction });
        await this.followMark(
          member,
          sitting,
          byId.get(itemId)!,
          { correct: left.correct, answer: left.answer },
          null,
          'the item’s mark was removed from the sitting',
          { changes, misses },
          transaction,
        );
      }
      return { ...(await this.findOne(member, id, transaction)), misses: changes };
    });
  }

  /**
   * For the patterns module: the items a student got right in their sittings, with the
   * problem and the answer (the child's when typed, else the key's), by day.
   */
  async rightItemsOf(
    member: MemberContext,
    studentId: number,
    range: { from?: string; to?: string } = {},
  ): Promise<{ occurredOn: string; problem: string; answer: string }[]> {
    const sittings = await this.sittingModel.findAll({
      where: this.listWhere(member, { ...range, studentId }),
      attributes: ['id', 'answerKeyId', 'startedAt'],
      order: [
        ['startedAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    if (sittings.length === 0) return [];
    const marks = await this.markModel.findAll({
      where: { sittingId: { [Op.in]: sittings.map((s) => s.id) }, correct: true },
    });
    const items = new Map<number, KeyItem>();
    for (const keyId of new Set(sittings.map((s) => s.answerKeyId)))
      for (const item of await this.keys.itemsOf(keyId)) items.set(item.id, item);
    const day = new Map(sittings.map((s) => [s.id, s.startedAt.slice(0, 10)]));
    return marks.flatMap((m) => {
      const item = items.get(m.keyItemId);
      return item
        ? [
            {
              occurredOn: day.get(m.sittingId)!,
              problem: item.prompt,
              answer: m.answer ?? item.answer,
            },
          ]
        : [];
    });
  }

  async summary(member: MemberContext, studentId: number, query: SittingRangeQuery) {
    const student = await this.students.findModel(member, studentId);
    const where = this.listWhere(member, { ...query, studentId });
    const sittings = await this.sittingModel.findAll({
      where,
      include: [AnswerKey],
      order: [
        ['startedAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    const tallies = await this.tallies(sittings.map((s) => s.id));
    const overTime = sittings.map((s) => {
      const t = tallies.get(s.id) ?? { correct: 0, marked: 0 };
      return {
        sittingId: s.id,
        startedAt: s.startedAt,
        date: s.startedAt.slice(0, 10),
        answerKeyId: s.answerKeyId,
        title: s.answerKey?.title ?? '',
        kind: s.answerKey?.kind ?? null,
        timeOfDay: s.timeOfDay,
        minutes: s.minutes,
        conditions: { rested: s.rested, afterMeal: s.afterMeal },
        ...scoreOf(t),
      };
    });
    const marked = overTime.filter((s) => s.marked > 0);
    const group = (pick: (s: (typeof marked)[number]) => boolean) => {
      const chosen = marked.filter(pick);
      return { sittings: chosen.length, ...scoreOf(sumTallies(chosen)) };
    };
    const yesNo = (value: (s: (typeof marked)[number]) => boolean | null) => ({
      yes: group((s) => value(s) === true),
      no: group((s) => value(s) === false),
      notNoted: group((s) => value(s) === null),
    });
    return {
      studentId: student.id,
      from: query.from ?? null,
      to: query.to ?? null,
      sittings: marked.length,
      overall: { sittings: marked.length, ...scoreOf(sumTallies(marked)) },
      overTime,
      byTimeOfDay: TIME_OF_DAY_BANDS.map((band) => ({
        timeOfDay: band.name,
        from: band.from,
        to: band.to,
        ...group((s) => s.timeOfDay === band.name),
      })),
      byCondition: {
        rested: yesNo((s) => s.conditions.rested),
        afterMeal: yesNo((s) => s.conditions.afterMeal),
      },
      caution: SUMMARY_CAUTION,
    };
  }

  /** Re-marks every sitting marked against items whose key answer was corrected. */
  private async remark(
    member: MemberContext,
    changes: readonly AnswerChange[],
    reason: string,
    transaction: Transaction,
  ): Promise<RemarkedSitting[]> {
    const byItem = new Map(changes.map((c) => [c.itemId, c]));
    const marks = await this.markModel.findAll({
      where: { keyItemId: { [Op.in]: [...byItem.keys()] } },
      transaction,
    });
    const sittingIds = [...new Set(marks.map((m) => m.sittingId))];
    if (sittingIds.length === 0) return [];
    const sittings = await this.sittingModel.findAll({
      where: { id: { [Op.in]: sittingIds }, householdId: member.householdId },
      include: [AnswerKey],
      transaction,
    });
    const items = new Map(
      (await this.keys.itemsOf(sittings[0]!.answerKeyId, transaction)).map((i) => [i.id, i]),
    );
    const before = await this.tallies(sittingIds, transaction);
    const out: RemarkedSitting[] = [];
    for (const sitting of sittings) {
      const missChanges = emptyChanges();
      const misses = await this.misses.findForSitting(sitting.id, transaction);
      const itemIds: number[] = [];
      for (const mark of marks.filter((m) => m.sittingId === sitting.id)) {
        const change = byItem.get(mark.keyItemId)!;
        // A right mark with no answer typed means the child wrote what the key said then.
        const childAnswer = mark.answer ?? (mark.correct ? change.from : null);
        const correct = childAnswer !== null && sameAnswerOf(childAnswer, change.to);
        if (correct === mark.correct) {
          // A wrong mark held while the key was flagged gets its miss once the key is checked.
          const item = items.get(mark.keyItemId)!;
          if (!correct && !misses.has(item.id) && !keyFlagged(item)) {
            await this.followMark(
              member,
              sitting,
              item,
              null,
              { correct: false, answer: mark.answer },
              '',
              { changes: missChanges, misses },
              transaction,
            );
            itemIds.push(mark.keyItemId);
          }
          continue;
        }
        const was = { correct: mark.correct, answer: mark.answer };
        await mark.update({ correct, answer: childAnswer }, { transaction });
        itemIds.push(mark.keyItemId);
        await this.followMark(
          member,
          sitting,
          items.get(mark.keyItemId)!,
          was,
          { correct, answer: childAnswer },
          `the key was corrected (item ${change.number}: ${change.from} → ${change.to}): ${reason}`,
          { changes: missChanges, misses },
          transaction,
        );
      }
      if (itemIds.length === 0) continue;
      const after = tallyOf(
        await this.markModel.findAll({ where: { sittingId: sitting.id }, transaction }),
      );
      out.push({
        sittingId: sitting.id,
        studentId: sitting.studentId,
        before: before.get(sitting.id) ?? { correct: 0, marked: 0 },
        after,
        itemIds,
        resolvedMissIds: missChanges.resolvedMissIds,
        newMissIds: [...missChanges.createdMissIds, ...missChanges.reopenedMissIds],
      });
    }
    return out;
  }

  /**
   * Keeps one item's miss in step with its mark, by the change of the mark (so repeating a
   * save does nothing): wrong now and not before → a miss (or its old one reopened); right
   * or unmarked now after wrong → resolved with the reason; wrong with a new answer → the
   * miss takes the new answer.
   */
  private async followMark(
    member: MemberContext,
    sitting: Sitting,
    item: KeyItem,
    was: { correct: boolean; answer: string | null } | null,
    now: { correct: boolean; answer: string | null; cause?: Cause } | null,
    resolveReason: string,
    {
      changes,
      misses,
      hold = false,
    }: {
      changes: MissChanges;
      misses: Map<number, { id: number; status: string }>;
      hold?: boolean;
    },
    transaction: Transaction,
  ): Promise<void> {
    const wasWrong = was !== null && !was.correct;
    const nowWrong = now !== null && !now.correct;
    if (!wasWrong && !nowWrong) return;
    const existing = misses.get(item.id);
    if (nowWrong && !wasWrong && hold && !existing) {
      changes.heldItemIds.push(item.id);
      return;
    }
    if (nowWrong && !wasWrong) {
      if (existing) {
        await this.misses.reopenFromMark(member, existing.id, now.answer ?? '', transaction);
        existing.status = 'logged';
        changes.reopenedMissIds.push(existing.id);
      } else {
        const id = await this.misses.createFromMark(
          member,
          {
            studentId: sitting.studentId,
            occurredOn: sitting.startedAt.slice(0, 10),
            problem: item.prompt,
            answer: now.answer ?? '',
            skills: item.skills,
            revisit: revisitLessons(item.revisit).map(String),
            sittingId: sitting.id,
            keyItemId: item.id,
            cause: now.cause,
          },
          transaction,
        );
        misses.set(item.id, { id, status: 'logged' });
        changes.createdMissIds.push(id);
      }
    } else if (wasWrong && !nowWrong) {
      if (existing && existing.status !== 'resolved') {
        await this.misses.resolveFromMark(member, existing.id, resolveReason, transaction);
        existing.status = 'resolved';
        changes.resolvedMissIds.push(existing.id);
      }
    } else if (existing && (was!.answer ?? '') !== (now!.answer ?? '')) {
      await this.misses.answerFromMark(member, existing.id, now!.answer ?? '', transaction);
      changes.updatedMissIds.push(existing.id);
    }
  }

  private listWhere(
    member: MemberContext,
    q: { studentId?: number; answerKeyId?: number; from?: string; to?: string },
  ): WhereOptions<Sitting> {
    if (q.from && q.to && q.from > q.to) throw fieldsError({ to: 'to must be on or after from' });
    const and: WhereOptions<Sitting>[] = [this.scope(member)];
    if (q.studentId !== undefined) and.push({ studentId: q.studentId });
    if (q.answerKeyId !== undefined) and.push({ answerKeyId: q.answerKeyId });
    if (q.from) and.push({ startedAt: { [Op.gte]: q.from } });
    // Local times sort as text; the whole `to` day is in.
    if (q.to) and.push({ startedAt: { [Op.lt]: `${q.to}T99` } });
    return { [Op.and]: and };
  }

  private async tallies(sittingIds: readonly number[], transaction?: Transaction) {
    const out = new Map<number, Tally>();
    if (sittingIds.length === 0) return out;
    const marks = await this.markModel.findAll({
      where: { sittingId: { [Op.in]: [...sittingIds] } },
      attributes: ['sittingId', 'correct'],
      transaction,
    });
    for (const m of marks) {
      const t = out.get(m.sittingId) ?? { correct: 0, marked: 0 };
      t.marked += 1;
      if (m.correct) t.correct += 1;
      out.set(m.sittingId, t);
    }
    return out;
  }

  private async itemCounts(keyIds: readonly number[]) {
    const out = new Map<number, number>();
    for (const id of new Set(keyIds)) out.set(id, (await this.keys.itemsOf(id)).length);
    return out;
  }

  private async sittingCounts(
    keyIds: readonly number[],
    transaction?: Transaction,
    studentIds: readonly number[] | null = null,
  ) {
    const rows = (await this.sittingModel.count({
      where: {
        answerKeyId: { [Op.in]: [...keyIds] },
        ...(studentIds !== null && { studentId: { [Op.in]: [...studentIds] } }),
      },
      group: ['answerKeyId'],
      transaction,
    })) as unknown as { answerKeyId: number; count: number }[];
    return new Map(rows.map((r) => [r.answerKeyId, r.count]));
  }

  private async sittingsOf(
    sittingIds: readonly number[],
    studentIds: readonly number[],
    transaction?: Transaction,
  ): Promise<Set<number>> {
    if (sittingIds.length === 0 || studentIds.length === 0) return new Set();
    const rows = await this.sittingModel.findAll({
      attributes: ['id'],
      where: { id: { [Op.in]: [...new Set(sittingIds)] }, studentId: { [Op.in]: [...studentIds] } },
      transaction,
    });
    return new Set(rows.map((r) => r.id));
  }

  private async markCounts(itemIds: readonly number[], transaction?: Transaction) {
    const rows = (await this.markModel.count({
      where: { keyItemId: { [Op.in]: [...itemIds] } },
      group: ['keyItemId'],
      transaction,
    })) as unknown as { keyItemId: number; count: number }[];
    return new Map(rows.map((r) => [r.keyItemId, r.count]));
  }
}

/** Whether the checker disagrees with (or cannot read) the key's answer to this item. */
function keyFlagged(item: { number: number; prompt: string; answer: string }): boolean {
  const status = checkItem(item).status;
  return status === 'disagrees' || status === 'unreadable-answer';
}

const emptyChanges = (): MissChanges => ({
  heldItemIds: [],
  createdMissIds: [],
  reopenedMissIds: [],
  resolvedMissIds: [],
  updatedMissIds: [],
});

function tallyOf(marks: readonly { correct: boolean }[]): Tally {
  return { correct: marks.filter((m) => m.correct).length, marked: marks.length };
}

function sumTallies(list: readonly Tally[]): Tally {
  return list.reduce((a, t) => ({ correct: a.correct + t.correct, marked: a.marked + t.marked }), {
    correct: 0,
    marked: 0,
  });
}

/** `{ correct, marked, wrong, percent }`; percent is of the items marked, null when none are. */
function scoreOf(t: Tally) {
  return {
    correct: t.correct,
    marked: t.marked,
    wrong: t.marked - t.correct,
    percent: t.marked === 0 ? null : Math.round((100 * t.correct) / t.marked),
  };
}

function toSittingSummary(s: Sitting, tally: Tally | undefined, items: number) {
  return {
    id: s.id,
    studentId: s.studentId,
    answerKeyId: s.answerKeyId,
    answerKey: s.answerKey
      ? { id: s.answerKey.id, title: s.answerKey.title, kind: s.answerKey.kind }
      : null,
    startedAt: s.startedAt,
    date: s.startedAt.slice(0, 10),
    timeOfDay: s.timeOfDay,
    minutes: s.minutes,
    conditions: { rested: s.rested, afterMeal: s.afterMeal, note: s.note },
    score: { items, ...scoreOf(tally ?? { correct: 0, marked: 0 }) },
    createdAt: s.createdAt,
    updatedAt: s.updatedAt,
  };
}
