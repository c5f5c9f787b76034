import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { Op, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { revisitLessons } from '@workback/core';
import type { MemberContext } from '../common/member-context.js';
import { type FindLock, lockIf } from '../database/row-lock.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { CurriculumService } from '../curriculum/curriculum.service.js';
import { placeholders, SqlReader } from '../database/sql-reader.js';
import { checkItem } from './cross-check.js';
import type { CreateAnswerKeyDto } from './dto/create-answer-key.dto.js';
import { checkItems, type CourseLessons, type ItemFields } from './key-item-checks.js';
import { toCorrectionJson, toKeySummary } from './key-json.js';
import { AnswerKey, type KeyKind } from './models/answer-key.model.js';
import { KeyCorrection } from './models/key-correction.model.js';
import { KeyItem } from './models/key-item.model.js';
import type { KeyUsage, RemarkedSitting } from './key-usage.js';

@Injectable()
export class AnswerKeysService {
  private usage: KeyUsage | null = null;

  constructor(
    @InjectModel(AnswerKey) private readonly keyModel: typeof AnswerKey,
    @InjectModel(KeyItem) private readonly itemModel: typeof KeyItem,
    @InjectModel(KeyCorrection) private readonly correctionModel: typeof KeyCorrection,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly curriculum: CurriculumService,
    private readonly reader: SqlReader,
  ) {
    curriculum.registerUsage({
      courseUsers: (courseId) => this.courseUsers(courseId),
      lessonUsers: (courseId, n) => this.lessonUsers(courseId, n),
    });
  }

  /** The sittings module registers here once (it depends on keys, not the other way round). */
  registerUsage(usage: KeyUsage): void {
    this.usage = usage;
  }

  async findAll(member: MemberContext, query: { courseId?: number; kind?: KeyKind } = {}) {
    const keys = await this.keyModel.findAll({
      where: {
        householdId: member.householdId,
        ...(query.courseId !== undefined && { courseId: query.courseId }),
        ...(query.kind !== undefined && { kind: query.kind }),
      },
      order: [
        ['title', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    const ids = keys.map((k) => k.id);
    const items = ids.length
      ? await this.itemModel.findAll({ where: { answerKeyId: ids }, order: [['number', 'ASC']] })
      : [];
    const sittings = await this.sittingCounts(ids, undefined, member.studentIds);
    const list = keys.map((k) => {
      const own = items.filter((i) => i.answerKeyId === k.id);
      return {
        ...toKeySummary(k),
        itemCount: own.length,
        flagCount: own.filter((i) => isFlag(checkItem(i).status)).length,
        sittingCount: sittings.get(k.id) ?? 0,
      };
    });
    return { items: list, total: list.length };
  }

  /**
   * For review plans: the courses of the household's keys these items belong to, most used
   * first. One read (items joined to their keys): every print of a plan asks, and each read
   * waits its turn of a busy event loop.
   */
  async coursesOfItems(
    member: MemberContext,
    itemIds: readonly number[],
    transaction?: Transaction,
  ): Promise<number[]> {
    const ids = [...new Set(itemIds)];
    if (ids.length === 0) return [];
    const rows = await this.reader.rows<{ courseId: number; items: number | string }>(
      `SELECT "k"."course_id" AS "courseId", COUNT(*) AS "items"
       FROM "key_items" AS "i" JOIN "answer_keys" AS "k" ON "k"."id" = "i"."answer_key_id"
       WHERE "i"."id" IN (${placeholders(ids.length)}) AND "k"."household_id" = ?
         AND "k"."course_id" IS NOT NULL
       GROUP BY "k"."course_id"`,
      [...ids, member.householdId],
      transaction,
    );
    // COUNT(*) comes back as text from PostgreSQL (a bigint).
    return rows
      .map((r) => ({ id: Number(r.courseId), items: Number(r.items) }))
      .sort((a, b) => b.items - a.items || a.id - b.id)
      .map((r) => r.id);
  }

  async findOne(member: MemberContext, id: number, transaction?: Transaction) {
    const key = await this.findKeyModel(member, id, transaction);
    return this.toKeyJson(key, transaction, member.studentIds);
  }

  /** 404 both for what does not exist and for another household's key. `lock`: rowLock. */
  async findKeyModel(
    member: MemberContext,
    id: number,
    transaction?: Transaction,
    find: FindLock = {},
  ) {
    const key = await this.keyModel.findOne({
      where: { id, householdId: member.householdId },
      transaction,
      lock: lockIf(find, transaction, this.keyModel),
    });
    if (!key) throw new NotFoundException(`No answer key ${id} in this household`);
    return key;
  }

  itemsOf(keyId: number, transaction?: Transaction): Promise<KeyItem[]> {
    return this.itemModel.findAll({
      where: { answerKeyId: keyId },
      order: [['number', 'ASC']],
      transaction,
    });
  }

  async create(member: MemberContext, dto: CreateAnswerKeyDto) {
    return this.sequelize.transaction(async (transaction) => {
      const lessons = await this.lessonsFor(
        member,
        dto.courseId ?? null,
        dto.lessonNumber ?? null,
        transaction,
      );
      const items = checkItems(dto.items, lessons, (i) => `items.${i}`);
      return this.saveKey(member, dto, items, transaction);
    });
  }

  /** Writes a new key and its checked items; answers it as `findOne` does. */
  async saveKey(
    member: MemberContext,
    fields: Pick<CreateAnswerKeyDto, 'title' | 'kind' | 'courseId' | 'lessonNumber'>,
    items: readonly ItemFields[],
    transaction: Transaction,
  ) {
    const key = await this.keyModel.create(
      {
        householdId: member.householdId,
        title: fields.title,
        kind: fields.kind,
        courseId: fields.courseId ?? null,
        lessonNumber: fields.lessonNumber ?? null,
      },
      { transaction },
    );
    await this.itemModel.bulkCreate(
      items.map((i) => ({ ...i, answerKeyId: key.id })),
      { transaction },
    );
    return this.toKeyJson(key, transaction);
  }

  async remove(member: MemberContext, id: number): Promise<void> {
    await this.sequelize.transaction(async (transaction) => {
      const key = await this.findKeyModel(member, id, transaction);
      const sittings = (await this.sittingCounts([key.id], transaction)).get(key.id) ?? 0;
      if (sittings > 0) {
        throw new ConflictException(
          `Answer key “${key.title}” is used by ${sittings} sitting${sittings === 1 ? '' : 's'}; it cannot be deleted`,
        );
      }
      await this.correctionModel.destroy({ where: { answerKeyId: key.id }, transaction });
      await this.itemModel.destroy({ where: { answerKeyId: key.id }, transaction });
      await key.destroy({ transaction });
    });
  }

  /** The course's lessons (null without a course); 400 for a lesson the course does not have. */
  async lessonsFor(
    member: MemberContext,
    courseId: number | null,
    lessonNumber: number | null,
    transaction: Transaction,
  ): Promise<CourseLessons> {
    const lessons =
      courseId === null
        ? null
        : await this.curriculum
            .findCourseModel(member, courseId, transaction)
            .then(async (course) => ({
              numbers: await this.curriculum.lessonNumbers(course.id, transaction),
              courseName: course.name,
            }));
    if (lessonNumber === null) return lessons;
    if (!lessons) throw fieldsError({ lessonNumber: 'lessonNumber needs a courseId' });
    if (!lessons.numbers.has(lessonNumber)) {
      throw fieldsError({
        lessonNumber: `lesson ${lessonNumber} is not in “${lessons.courseName}”`,
      });
    }
    return lessons;
  }

  /** A key as `studentIds` may see it: a tutor's counts and re-marked sittings are of their students. */
  async toKeyJson(
    key: AnswerKey,
    transaction?: Transaction,
    studentIds: readonly number[] | null = null,
  ) {
    const items = await this.itemsOf(key.id, transaction);
    const corrections = await this.correctionModel.findAll({
      where: { answerKeyId: key.id },
      order: [['id', 'ASC']],
      transaction,
    });
    const sittings = await this.sittingCounts([key.id], transaction, studentIds);
    const visible =
      studentIds === null || !this.usage
        ? null
        : await this.usage.sittingsOf(
            corrections.flatMap((c) => c.remarked),
            studentIds,
            transaction,
          );
    const checked = items.map((i) => ({ item: i, check: checkItem(i) }));
    return {
      ...toKeySummary(key),
      itemCount: items.length,
      sittingCount: sittings.get(key.id) ?? 0,
      items: checked.map(({ item, check }) => ({
        id: item.id,
        number: item.number,
        prompt: item.prompt,
        answer: item.answer,
        skills: item.skills,
        revisit: item.revisit,
        revisitLessons: revisitLessons(item.revisit),
        facts: item.facts,
        check,
      })),
      flags: checked.flatMap(({ item, check }) =>
        check.status === 'disagrees' || check.status === 'unreadable-answer'
          ? [
              {
                itemId: item.id,
                number: item.number,
                status: check.status,
                expected: check.expected,
                message: check.message,
              },
            ]
          : [],
      ),
      corrections: corrections.map((c) =>
        toCorrectionJson(c, visible ? c.remarked.filter((id) => visible.has(id)) : c.remarked),
      ),
    };
  }

  async sittingCounts(
    keyIds: readonly number[],
    transaction?: Transaction,
    studentIds: readonly number[] | null = null,
  ) {
    return this.usage && keyIds.length
      ? this.usage.sittingCounts(keyIds, transaction, studentIds)
      : new Map<number, number>();
  }

  async markCounts(itemIds: readonly number[], transaction?: Transaction) {
    return this.usage && itemIds.length
      ? this.usage.markCounts(itemIds, transaction)
      : new Map<number, number>();
  }

  /** Re-marks the sittings marked against changed answers (none while no sittings module is there). */
  async remark(...args: Parameters<KeyUsage['remark']>): Promise<RemarkedSitting[]> {
    return this.usage ? this.usage.remark(...args) : [];
  }

  private async courseUsers(courseId: number): Promise<string[]> {
    const keys = await this.keyModel.findAll({ where: { courseId }, order: [['title', 'ASC']] });
    return keys.map((k) => `answer key “${k.title}”`);
  }

  private async lessonUsers(courseId: number, lessonNumber: number): Promise<string[]> {
    const keys = await this.keyModel.findAll({ where: { courseId }, order: [['title', 'ASC']] });
    if (keys.length === 0) return [];
    const items = await this.itemModel.findAll({
      where: { answerKeyId: { [Op.in]: keys.map((k) => k.id) } },
      order: [['number', 'ASC']],
    });
    const users: string[] = [];
    for (const key of keys) {
      if (key.lessonNumber === lessonNumber) users.push(`answer key “${key.title}”`);
      const numbers = items
        .filter((i) => i.answerKeyId === key.id && revisitLessons(i.revisit).includes(lessonNumber))
        .map((i) => i.number);
      if (numbers.length) {
        users.push(
          `“${key.title}” ${numbers.length === 1 ? 'item' : 'items'} ${numbers.join(', ')}`,
        );
      }
    }
    return users;
  }
}

const isFlag = (status: string) => status === 'disagrees' || status === 'unreadable-answer';
