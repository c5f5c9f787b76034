import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { AnswerKeysService } from '../answer-keys/answer-keys.service.js';
import { AnswerKey } from '../answer-keys/models/answer-key.model.js';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { type FindLock, lockIf } from '../database/row-lock.js';
import { checkCalendarDate } from '../misses/dto/calendar-date.validator.js';
import { MarkedMissesService } from '../misses/marked-misses.service.js';
import { StudentsService } from '../students/students.service.js';
import type { CreateSittingDto } from './dto/create-sitting.dto.js';
import type { ListSittingsQuery } from './dto/list-sittings.query.js';
import { SittingMark } from './models/sitting-mark.model.js';
import { Sitting } from './models/sitting.model.js';
import { keyFlagged, tallyOf, toSittingSummary, type Tally } from './sitting-json.js';
import { readLocalTime, timeOfDayOf } from './time-of-day.js';

/** Sittings themselves: listed, read with their marks, started, discarded while unmarked. */
@Injectable()
export class SittingsService {
  constructor(
    @InjectModel(Sitting) private readonly sittingModel: typeof Sitting,
    @InjectModel(SittingMark) private readonly markModel: typeof SittingMark,
    private readonly students: StudentsService,
    private readonly keys: AnswerKeysService,
    private readonly misses: MarkedMissesService,
  ) {}

  /** The sittings a member may see: the household's, and for a tutor the granted students'. */
  scope(member: MemberContext): WhereOptions<Sitting> {
    return member.studentIds === null
      ? { householdId: member.householdId }
      : { householdId: member.householdId, studentId: { [Op.in]: member.studentIds } };
  }

  async findAll(member: MemberContext, query: ListSittingsQuery) {
    if (query.studentId !== undefined) await this.students.find(member, query.studentId);
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
    return this.toJson(await this.readWhole(member, id, transaction));
  }

  /**
   * A sitting with its key's items, its marks and the misses they made. The marks and misses
   * are read beside the sitting (a sitting the member may not see answers 404 before any of
   * them is used), then the items of its key: two waits for the event loop, not four.
   */
  async readWhole(member: MemberContext, id: number, transaction?: Transaction) {
    const [sitting, marks, misses] = await Promise.all([
      this.findModel(member, id, transaction),
      this.markModel.findAll({ where: { sittingId: id }, transaction }),
      this.misses.findForSitting(id, transaction),
    ]);
    const items = await this.keys.itemsOf(sitting.answerKeyId, transaction);
    return { sitting, items, marks, misses };
  }

  /** findOne's answer from a sitting read whole (readWhole). */
  toJson({ sitting, items, marks, misses }: SittingRead) {
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

  /**
   * 404 both for what does not exist and for a sitting of a student the member may not see.
   * `lock` takes its row until `transaction` ends (rowLock).
   */
  async findModel(
    member: MemberContext,
    id: number,
    transaction?: Transaction,
    find: FindLock = {},
  ) {
    const sitting = await this.sittingModel.findOne({
      where: { [Op.and]: [this.scope(member), { id }] },
      include: [AnswerKey],
      transaction,
      lock: lockIf(find, transaction, this.sittingModel),
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
    await this.students.find(member, dto.studentId);
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

  /** The conditions of a list of sittings (a 400 when `to` is before `from`). */
  listWhere(
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

  /** Right and marked counts per sitting. */
  async tallies(sittingIds: readonly number[], transaction?: Transaction) {
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

  /** Sittings per key (a tutor's: of their students only); the keys module asks through KeyUsage. */
  async sittingCounts(
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

  /** Which of these sittings are of these students. */
  async sittingsOf(
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
}

/** A sitting as readWhole reads it. */
export type SittingRead = Awaited<ReturnType<SittingsService['readWhole']>>;
