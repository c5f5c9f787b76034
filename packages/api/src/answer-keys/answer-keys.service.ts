import {
  ConflictException,
  Injectable,
  NotFoundException,
  UnsupportedMediaTypeException,
} from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { plainToInstance } from 'class-transformer';
import { validateSync } from 'class-validator';
import { Op, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import {
  controlCharacterAt,
  fieldsError,
  flattenValidationErrors,
} from '../common/pipes/validation.pipe.js';
import { CurriculumService } from '../curriculum/curriculum.service.js';
import { UsersService } from '../users/users.service.js';
import { checkItem } from './cross-check.js';
import { MAX_KEY_ITEMS, type CreateAnswerKeyDto } from './dto/create-answer-key.dto.js';
import type { ImportAnswerKeyDto } from './dto/import-answer-key.dto.js';
import { KeyItemDto } from './dto/key-item.dto.js';
import type { UpdateAnswerKeyDto } from './dto/update-answer-key.dto.js';
import { readKeyCsv, splitList, writeKeyCsv } from './key-csv.js';
import { AnswerKey, type KeyKind } from './models/answer-key.model.js';
import { KeyCorrection, type FieldChange } from './models/key-correction.model.js';
import { KeyItem } from './models/key-item.model.js';
import { readRevisit, revisitLessons } from './revisit.js';
import { sameAnswer } from './same-answer.js';

/** An item's answer changed after sittings were marked against it. */
export interface AnswerChange {
  itemId: number;
  number: number;
  from: string;
  to: string;
}

export interface RemarkedSitting {
  sittingId: number;
  studentId: number;
  before: { correct: number; marked: number };
  after: { correct: number; marked: number };
  /** The items whose marks changed in this sitting. */
  itemIds: number[];
  resolvedMissIds: number[];
  newMissIds: number[];
}

/** What the sittings module tells keys about their use, and how it re-marks after a correction. */
export interface KeyUsage {
  /** Sittings per key; with `studentIds` (a tutor's grant), only those students' sittings. */
  sittingCounts(
    keyIds: readonly number[],
    transaction?: Transaction,
    studentIds?: readonly number[] | null,
  ): Promise<Map<number, number>>;
  /** Which of these sittings are of these students. */
  sittingsOf(
    sittingIds: readonly number[],
    studentIds: readonly number[],
    transaction?: Transaction,
  ): Promise<Set<number>>;
  markCounts(itemIds: readonly number[], transaction?: Transaction): Promise<Map<number, number>>;
  remark(
    member: MemberContext,
    changes: readonly AnswerChange[],
    reason: string,
    transaction: Transaction,
  ): Promise<RemarkedSitting[]>;
}

const CSV_TYPES = new Set([
  'text/csv',
  'text/plain',
  'application/csv',
  'text/comma-separated-values',
  'application/vnd.ms-excel',
]);

type ItemFields = Pick<KeyItem, 'number' | 'prompt' | 'answer' | 'skills' | 'revisit' | 'facts'>;
const ITEM_FIELDS = ['number', 'prompt', 'answer', 'skills', 'revisit', 'facts'] as const;

@Injectable()
export class AnswerKeysService {
  private usage: KeyUsage | null = null;

  constructor(
    @InjectModel(AnswerKey) private readonly keyModel: typeof AnswerKey,
    @InjectModel(KeyItem) private readonly itemModel: typeof KeyItem,
    @InjectModel(KeyCorrection) private readonly correctionModel: typeof KeyCorrection,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly curriculum: CurriculumService,
    private readonly users: UsersService,
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

  /** For review plans: the courses of the household's keys these items belong to, most used first. */
  async coursesOfItems(
    member: MemberContext,
    itemIds: readonly number[],
    transaction?: Transaction,
  ): Promise<number[]> {
    if (itemIds.length === 0) return [];
    const items = await this.itemModel.findAll({
      where: { id: { [Op.in]: [...itemIds] } },
      attributes: ['answerKeyId'],
      transaction,
    });
    const keys = await this.keyModel.findAll({
      where: {
        householdId: member.householdId,
        id: { [Op.in]: [...new Set(items.map((i) => i.answerKeyId))] },
      },
      attributes: ['id', 'courseId'],
      transaction,
    });
    const count = new Map<number, number>();
    const courseOf = new Map(keys.map((k) => [k.id, k.courseId]));
    for (const i of items) {
      const c = courseOf.get(i.answerKeyId);
      if (c != null) count.set(c, (count.get(c) ?? 0) + 1);
    }
    return [...count].sort((a, b) => b[1] - a[1] || a[0] - b[0]).map(([id]) => id);
  }

  async findOne(member: MemberContext, id: number, transaction?: Transaction) {
    const key = await this.findKeyModel(member, id, transaction);
    return this.toKeyJson(key, transaction, member.studentIds);
  }

  /** 404 both for what does not exist and for another household's key. */
  async findKeyModel(member: MemberContext, id: number, transaction?: Transaction) {
    const key = await this.keyModel.findOne({
      where: { id, householdId: member.householdId },
      transaction,
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
      const lessons = await this.courseLessons(member, dto.courseId ?? null, transaction);
      this.refuseUnknownLesson(lessons, dto.lessonNumber ?? null);
      const items = this.checkItems(dto.items, lessons, (i) => `items.${i}`);
      const key = await this.keyModel.create(
        {
          householdId: member.householdId,
          title: dto.title,
          kind: dto.kind,
          courseId: dto.courseId ?? null,
          lessonNumber: dto.lessonNumber ?? null,
        },
        { transaction },
      );
      await this.itemModel.bulkCreate(
        items.map((i) => ({ ...i, answerKeyId: key.id })),
        { transaction },
      );
      return this.toKeyJson(key, transaction);
    });
  }

  /** A whole key from one CSV file: every bad row is listed, and nothing is saved unless all are good. */
  async importCsv(member: MemberContext, dto: ImportAnswerKeyDto, file?: Express.Multer.File) {
    if (!file) throw fieldsError({ file: 'file is missing: attach the CSV as “file”' });
    const looksLikeCsv = /\.(csv|txt)$/i.test(file.originalname) || CSV_TYPES.has(file.mimetype);
    if (!looksLikeCsv) {
      throw new UnsupportedMediaTypeException(
        `file must be a CSV text file (got ${file.mimetype || 'an unknown type'})`,
      );
    }
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
    } catch {
      throw new UnsupportedMediaTypeException(
        'file is not UTF-8 text: save the spreadsheet as “CSV UTF-8”',
      );
    }
    if (text.includes('\u0000')) {
      throw new UnsupportedMediaTypeException('file is not a CSV text file');
    }
    const read = readKeyCsv(text);
    if (!read.ok) throw rowsError(read.errors);
    const rowCount = read.rows.length + read.errors.length;
    if (rowCount === 0) throw fieldsError({ file: 'file has a header but no items' });
    if (rowCount > MAX_KEY_ITEMS) {
      throw fieldsError({
        file: `file has ${rowCount} items; a key holds at most ${MAX_KEY_ITEMS}`,
      });
    }

    return this.sequelize.transaction(async (transaction) => {
      const lessons = await this.courseLessons(member, dto.courseId ?? null, transaction);
      this.refuseUnknownLesson(lessons, dto.lessonNumber ?? null);
      const shapeErrors: Record<string, string> = Object.fromEntries(
        read.errors.map((e) => [`line ${e.line}.${e.field}`, e.message]),
      );
      const dtos = read.rows.map(({ line, values }) => {
        const item = plainToInstance(KeyItemDto, {
          number: /^\d+$/.test(values.number) ? Number(values.number) : values.number || undefined,
          prompt: values.prompt,
          answer: values.answer,
          skills: splitList(values.skills),
          revisit: splitList(values.revisit),
          facts: splitList(values.facts),
        });
        const errors = validateSync(item, { stopAtFirstError: true });
        for (const [field, message] of Object.entries(flattenValidationErrors(errors))) {
          shapeErrors[`line ${line}.${field}`] = message;
        }
        // The file's cells are text fields like any other: no NUL or other control characters.
        const control = controlCharacterAt(item);
        if (control) {
          shapeErrors[`line ${line}.${control.path.split('.')[0]}`] =
            `${control.path} must not hold control characters`;
        }
        return item;
      });
      const lines = read.rows.map((r) => r.line);
      const items = this.checkItems(dtos, lessons, (i) => `line ${lines[i]}`, shapeErrors, 'row');
      const key = await this.keyModel.create(
        {
          householdId: member.householdId,
          title: dto.title,
          kind: dto.kind,
          courseId: dto.courseId ?? null,
          lessonNumber: dto.lessonNumber ?? null,
        },
        { transaction },
      );
      await this.itemModel.bulkCreate(
        items.map((i) => ({ ...i, answerKeyId: key.id })),
        { transaction },
      );
      return this.toKeyJson(key, transaction);
    });
  }

  async exportCsv(member: MemberContext, id: number) {
    const key = await this.findKeyModel(member, id);
    const items = await this.itemsOf(key.id);
    const slug =
      key.title
        .toLowerCase()
        .replace(/[^a-z0-9]+/g, '-')
        .replace(/^-|-$/g, '') || 'answer-key';
    return { filename: `${slug}.csv`, body: writeKeyCsv(items) };
  }

  /**
   * Edits a key. Once it has sittings, every changed item is recorded as a correction
   * (what, why, when, who) and the sittings marked against it are re-marked.
   */
  async update(member: MemberContext, id: number, dto: UpdateAnswerKeyDto) {
    return this.sequelize.transaction(async (transaction) => {
      const key = await this.findKeyModel(member, id, transaction);
      const courseId = dto.courseId !== undefined ? dto.courseId : key.courseId;
      const lessonNumber = dto.lessonNumber !== undefined ? dto.lessonNumber : key.lessonNumber;
      const lessons = await this.courseLessons(member, courseId, transaction);
      this.refuseUnknownLesson(lessons, lessonNumber);
      const existing = await this.itemsOf(key.id, transaction);

      let corrections: KeyCorrection[] = [];
      let remarked: RemarkedSitting[] = [];
      if (dto.items !== undefined) {
        ({ corrections, remarked } = await this.replaceItems(
          member,
          key,
          existing,
          dto,
          lessons,
          transaction,
        ));
      } else if (courseId !== key.courseId && lessons) {
        // A new course: the lessons to revisit must exist in it.
        this.checkItems(existing, lessons, (i) => `items.${i}`);
      }
      await key.update(
        {
          ...(dto.title !== undefined && { title: dto.title }),
          ...(dto.kind !== undefined && { kind: dto.kind }),
          courseId,
          lessonNumber,
        },
        { transaction },
      );
      return {
        ...(await this.toKeyJson(key, transaction)),
        newCorrections: corrections.map((c) => toCorrectionJson(c)),
        remarkedSittings: remarked,
      };
    });
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

  private async replaceItems(
    member: MemberContext,
    key: AnswerKey,
    existing: KeyItem[],
    dto: UpdateAnswerKeyDto,
    lessons: { numbers: Set<number>; courseName: string } | null,
    transaction: Transaction,
  ) {
    const input = dto.items!;
    const byId = new Map(existing.map((i) => [i.id, i]));
    const idErrors: Record<string, string> = {};
    const seen = new Set<number>();
    input.forEach((item, index) => {
      if (item.id === undefined) return;
      if (!byId.has(item.id)) idErrors[`items.${index}.id`] = `item ${item.id} is not in this key`;
      else if (seen.has(item.id)) idErrors[`items.${index}.id`] = `item ${item.id} is listed twice`;
      seen.add(item.id);
    });
    const clean = this.checkItems(input, lessons, (i) => `items.${i}`, idErrors);

    const removed = existing.filter((i) => !seen.has(i.id));
    const marks = await this.markCounts(
      existing.map((i) => i.id),
      transaction,
    );
    const removedMarked = removed.filter((i) => (marks.get(i.id) ?? 0) > 0);
    if (removedMarked.length > 0) {
      throw new ConflictException(
        `${removedMarked.map((i) => `item ${i.number}`).join(', ')} ${removedMarked.length === 1 ? 'has' : 'have'} marks in sittings; correct ${removedMarked.length === 1 ? 'it' : 'them'} instead of removing`,
      );
    }

    const hasSittings = ((await this.sittingCounts([key.id], transaction)).get(key.id) ?? 0) > 0;
    const edits = input.flatMap((item, index) => {
      if (item.id === undefined) return [];
      const before = byId.get(item.id)!;
      const changes = diffItem(before, clean[index]!);
      return Object.keys(changes).length ? [{ before, after: clean[index]!, changes }] : [];
    });
    if (hasSittings && (edits.length > 0 || removed.length > 0) && !dto.reason) {
      throw fieldsError({
        reason:
          'say why the key changed: this key has sittings, and the reason is kept with the correction',
      });
    }

    // Renumbered items step aside first so the unique (key, number) index never sees a clash.
    for (const { before } of edits.filter((e) => 'number' in e.changes)) {
      await before.update({ number: -before.id }, { transaction });
    }
    for (const { before, after } of edits) await before.update(after, { transaction });
    if (removed.length) {
      await this.correctionModel.update(
        { keyItemId: null },
        { where: { keyItemId: removed.map((i) => i.id) }, transaction },
      );
      await this.itemModel.destroy({ where: { id: removed.map((i) => i.id) }, transaction });
    }
    const added = input.flatMap((item, index) => (item.id === undefined ? [clean[index]!] : []));
    if (added.length) {
      await this.itemModel.bulkCreate(
        added.map((i) => ({ ...i, answerKeyId: key.id })),
        { transaction },
      );
    }

    if (!hasSittings) return { corrections: [], remarked: [] };
    const reason = dto.reason!;
    const answerChanges: AnswerChange[] = edits.flatMap((e) => {
      const from = e.changes.answer ? String(e.changes.answer.from) : null;
      return from !== null && !sameAnswer(from, e.after.answer)
        ? [{ itemId: e.before.id, number: e.after.number, from, to: e.after.answer }]
        : [];
    });
    const remarked =
      answerChanges.length && this.usage
        ? await this.usage.remark(member, answerChanges, reason, transaction)
        : [];
    const author = await this.users.findById(member.userId);
    const corrections: KeyCorrection[] = [];
    for (const e of edits) {
      const touched = remarked
        .filter((r) => r.itemIds.includes(e.before.id))
        .map((r) => r.sittingId);
      corrections.push(
        await this.correctionModel.create(
          {
            answerKeyId: key.id,
            keyItemId: e.before.id,
            itemNumber: e.after.number,
            changes: e.changes,
            reason,
            madeByUserId: member.userId,
            madeByName: author?.displayName ?? 'a member',
            remarked: touched,
          },
          { transaction },
        ),
      );
    }
    for (const r of removed) {
      corrections.push(
        await this.correctionModel.create(
          {
            answerKeyId: key.id,
            keyItemId: null,
            itemNumber: r.number,
            changes: { removed: { from: r.prompt, to: null } },
            reason,
            madeByUserId: member.userId,
            madeByName: author?.displayName ?? 'a member',
            remarked: [],
          },
          { transaction },
        ),
      );
    }
    return { corrections, remarked };
  }

  /**
   * The checks class-validator cannot make: revisit entries, lessons the course has,
   * numbers used once. Throws one 400 listing every problem (with `known` ones from earlier).
   */
  private checkItems(
    items: readonly {
      number: number;
      prompt: string;
      answer: string;
      skills?: readonly string[];
      revisit?: readonly string[];
      facts?: readonly string[];
    }[],
    lessons: { numbers: Set<number>; courseName: string } | null,
    where: (index: number) => string,
    known: Record<string, string> = {},
    noun: 'item' | 'row' = 'item',
  ): ItemFields[] {
    const errors: Record<string, string> = { ...known };
    const numbers = new Map<number, number>();
    const out = items.map((item, index) => {
      const at = where(index);
      if (typeof item.number === 'number' && !errors[`${at}.number`]) {
        const first = numbers.get(item.number);
        if (first !== undefined) {
          errors[`${at}.number`] = `number ${item.number} is used twice (first at ${where(first)})`;
        } else numbers.set(item.number, index);
      }
      let revisit: string[] = [];
      if (!errors[`${at}.revisit`]) {
        const read = readRevisit(item.revisit ?? []);
        if (!read.ok) errors[`${at}.revisit`] = read.message;
        else {
          revisit = read.entries;
          const unknown = lessons ? read.lessons.filter((n) => !lessons.numbers.has(n)) : [];
          if (unknown.length) {
            errors[`${at}.revisit`] =
              `${unknown.length === 1 ? 'lesson' : 'lessons'} ${unknown.join(', ')} ${unknown.length === 1 ? 'is' : 'are'} not in “${lessons!.courseName}”`;
          }
        }
      }
      return {
        number: item.number,
        prompt: item.prompt,
        answer: item.answer,
        skills: dedupe(item.skills ?? []),
        revisit,
        facts: dedupe(item.facts ?? []),
      };
    });
    if (Object.keys(errors).length > 0) {
      throw noun === 'row' ? itemsError(errors, 'row', 'imported') : itemsError(errors);
    }
    return out;
  }

  private async courseLessons(
    member: MemberContext,
    courseId: number | null,
    transaction: Transaction,
  ): Promise<{ numbers: Set<number>; courseName: string } | null> {
    if (courseId === null) return null;
    const course = await this.curriculum.findCourseModel(member, courseId, transaction);
    return {
      numbers: await this.curriculum.lessonNumbers(course.id, transaction),
      courseName: course.name,
    };
  }

  private refuseUnknownLesson(
    lessons: { numbers: Set<number>; courseName: string } | null,
    lessonNumber: number | null,
  ): void {
    if (lessonNumber === null) return;
    if (!lessons) throw fieldsError({ lessonNumber: 'lessonNumber needs a courseId' });
    if (!lessons.numbers.has(lessonNumber)) {
      throw fieldsError({
        lessonNumber: `lesson ${lessonNumber} is not in “${lessons.courseName}”`,
      });
    }
  }

  /** A key as `studentIds` may see it: a tutor's counts and re-marked sittings are of their students. */
  private async toKeyJson(
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

  private async sittingCounts(
    keyIds: readonly number[],
    transaction?: Transaction,
    studentIds: readonly number[] | null = null,
  ) {
    return this.usage && keyIds.length
      ? this.usage.sittingCounts(keyIds, transaction, studentIds)
      : new Map<number, number>();
  }

  private async markCounts(itemIds: readonly number[], transaction?: Transaction) {
    return this.usage && itemIds.length
      ? this.usage.markCounts(itemIds, transaction)
      : new Map<number, number>();
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

const dedupe = (list: readonly string[]) => [...new Set(list)];

function diffItem(before: KeyItem, after: ItemFields): Record<string, FieldChange> {
  const changes: Record<string, FieldChange> = {};
  for (const field of ITEM_FIELDS) {
    const from = before[field];
    const to = after[field];
    if (JSON.stringify(from) !== JSON.stringify(to)) changes[field] = { from, to };
  }
  return changes;
}

/** One 400 naming every bad item (`items.3.answer`) or CSV row (`line 5.answer`). */
function itemsError(fields: Record<string, string>, noun = 'item', verb = 'saved') {
  const count = new Set(Object.keys(fields).map((k) => k.split('.').slice(0, -1).join('.'))).size;
  const error = fieldsError(fields);
  const response = error.getResponse() as { message: string };
  const plural = count === 1 ? `${noun} has` : `${noun}s have`;
  response.message = `${count} ${plural} problems; nothing was ${verb}. ${response.message}`;
  return error;
}

function rowsError(errors: { line: number; field: string; message: string }[]) {
  return itemsError(
    Object.fromEntries(errors.map((e) => [`line ${e.line}.${e.field}`, e.message])),
    'row',
    'imported',
  );
}

function toKeySummary(k: AnswerKey) {
  return {
    id: k.id,
    title: k.title,
    kind: k.kind,
    courseId: k.courseId,
    lessonNumber: k.lessonNumber,
    createdAt: k.createdAt,
    updatedAt: k.updatedAt,
  };
}

function toCorrectionJson(c: KeyCorrection, remarked: readonly number[] = c.remarked) {
  return {
    id: c.id,
    itemId: c.keyItemId,
    itemNumber: c.itemNumber,
    changes: c.changes,
    reason: c.reason,
    madeBy: { userId: c.madeByUserId, name: c.madeByName },
    createdAt: c.createdAt,
    remarkedSittingIds: remarked,
  };
}
