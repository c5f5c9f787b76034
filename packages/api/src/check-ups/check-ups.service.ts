import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { planCheckUp, readCheckUp, ruleName } from '@workback/core';
import { Op } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { AnswerKeysService } from '../answer-keys/answer-keys.service.js';
import { sameAnswer } from '../answer-keys/same-answer.js';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { lockRow } from '../database/row-lock.js';
import { emptyChanges, SittingMarksService } from '../sittings/sitting-marks.service.js';
import { SittingsService } from '../sittings/sittings.service.js';
import { readLocalTime } from '../sittings/time-of-day.js';
import { StudentsService } from '../students/students.service.js';
import { childSheetPdf, parentSheetPdf } from './check-up-sheets.js';
import { hypothesisName, readingSentence } from './check-up-words.js';
import type { AnswerCheckUpDto } from './dto/answer-check-up.dto.js';
import type { CreateCheckUpDto } from './dto/create-check-up.dto.js';
import type { ListCheckUpsQuery } from './dto/list-check-ups.query.js';
import { CheckUp } from './models/check-up.model.js';

@Injectable()
export class CheckUpsService {
  constructor(
    @InjectModel(CheckUp) private readonly checkUpModel: typeof CheckUp,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly students: StudentsService,
    private readonly keys: AnswerKeysService,
    private readonly sittings: SittingsService,
    private readonly marks: SittingMarksService,
  ) {}

  /** The check-ups a member may see: the household's, and for a tutor the granted students'. */
  private scope(member: MemberContext) {
    return member.studentIds === null
      ? { householdId: member.householdId }
      : { householdId: member.householdId, studentId: { [Op.in]: member.studentIds } };
  }

  async findAll(member: MemberContext, query: ListCheckUpsQuery) {
    if (query.studentId !== undefined) await this.students.find(member, query.studentId);
    const rows = await this.checkUpModel.findAll({
      where: {
        [Op.and]: [
          this.scope(member),
          ...(query.studentId === undefined ? [] : [{ studentId: query.studentId }]),
        ],
      },
      order: [['id', 'DESC']],
    });
    const items = rows.map((r) => this.toJson(r));
    return { items, total: items.length };
  }

  /**
   * For patterns: what the student's latest check-up on any of these rules says, or null.
   * `(await latestOn(member, 1))(['sub.borrow-from-zero'])` → `{ id: 4, status: 'confirmed', fits: 'sub.borrow-from-zero', … }`.
   */
  async latestOn(member: MemberContext, studentId: number) {
    const rows = await this.checkUpModel.findAll({
      where: { [Op.and]: [this.scope(member), { studentId }] },
      order: [['id', 'DESC']],
    });
    return (ruleIds: readonly string[]) => {
      const row = rows.find((r) => r.sheet.hypotheses.some((h) => ruleIds.includes(h)));
      if (row === undefined) return null;
      const json = this.toJson(row);
      return {
        id: json.id,
        createdAt: json.createdAt,
        status: json.status,
        fits: json.reading?.confirmed ?? null,
        ruledOut: json.reading?.ruledOut ?? [],
        sentence: json.reading?.sentence ?? null,
      };
    };
  }

  async findOne(member: MemberContext, id: number) {
    return this.toJson(await this.findModel(member, id));
  }

  /**
   * Plans the sheet for the student and keeps it as an answer key of kind `check-up`. The seed
   * counts the student's check-ups, so a second check-up on the same rules brings new problems.
   */
  async create(member: MemberContext, dto: CreateCheckUpDto) {
    const student = await this.students.find(member, dto.studentId);
    const earlier = await this.checkUpModel.count({
      where: { householdId: member.householdId, studentId: student.id },
    });
    const plan = planCheckUp(dto.ruleIds, { digits: dto.digits ?? 3, seed: earlier + 1 });
    if (!plan.ok) throw fieldsError({ ruleIds: plan.error.message });
    const title = `Check-up ${earlier + 1} for ${student.name}: ${[...new Set(plan.hypotheses.slice(1).map(ruleName))].join(', ')}`;
    const key = await this.keys.create(member, {
      title: title.length > 120 ? `${title.slice(0, 119)}…` : title,
      kind: 'check-up',
      courseId: null,
      lessonNumber: null,
      items: plan.problems.map((p, i) => ({
        number: i + 1,
        prompt: p.problem,
        answer: p.answers.correct as string,
        skills: [],
        revisit: [],
        facts: [],
      })),
    });
    try {
      const row = await this.checkUpModel.create({
        householdId: member.householdId,
        studentId: student.id,
        answerKeyId: key.id,
        sittingId: null,
        ruleIds: dto.ruleIds,
        sheet: {
          operation: plan.operation,
          hypotheses: plan.hypotheses,
          problems: plan.problems,
          merged: plan.merged,
        },
        reading: null,
      });
      return this.toJson(row);
    } catch (err) {
      await this.keys.remove(member, key.id);
      throw err;
    }
  }

  /**
   * Takes the check-up: a sitting of its key with the child's answers as marks (so wrong
   * answers become misses and right ones count against the rules in patterns), then reads
   * the answers against every hypothesis. The same answers sent again (a double tap, a retry
   * after a lost answer) are answered as the first, with no new sitting; others are refused.
   */
  async answer(member: MemberContext, id: number, dto: AnswerCheckUpDto) {
    const row = await this.findModel(member, id);
    if (row.sittingId !== null) return this.answeredAgain(member, row, dto);
    const answers = this.readAnswers(row, dto);
    const reading = readCheckUp(row.sheet, answers);
    const items = await this.keys.itemsOf(row.answerKeyId);
    const sitting = await this.sittings.create(member, {
      studentId: row.studentId,
      answerKeyId: row.answerKeyId,
      startedAt: dto.startedAt,
      minutes: dto.minutes,
      conditions: dto.conditions,
    });
    // The check-up is claimed for this sitting with its row locked and sittingId read again:
    // of answers sent together, the ones that read "not taken" above before another claimed
    // it give their sitting back and are answered as a repeat (or refused).
    const claimed = await this.sequelize.transaction(async (transaction) => {
      const locked = await lockRow(this.checkUpModel, row.id, transaction);
      if (locked === null || locked.sittingId !== null) return null;
      await locked.update(
        { sittingId: sitting.id, reading: { ...reading, answers } },
        { transaction },
      );
      return locked;
    });
    if (claimed === null) {
      await this.sittings.discardUnmarked(member, sitting.id);
      return this.answeredAgain(member, await this.findModel(member, id), dto);
    }
    try {
      const marked = await this.marks.putMarks(member, sitting.id, {
        marks: items.flatMap((item, i) => {
          const written = answers[i] ?? null;
          if (written === null) return [];
          return [
            { keyItemId: item.id, correct: sameAnswer(written, item.answer), answer: written },
          ];
        }),
      });
      return { ...this.toJson(claimed), misses: marked.misses };
    } catch (err) {
      // Not taken after all: the claim is let go before its sitting can be removed.
      await this.checkUpModel.update(
        { sittingId: null, reading: null },
        { where: { id: row.id, sittingId: sitting.id } },
      );
      await this.sittings.discardUnmarked(member, sitting.id);
      throw err;
    }
  }

  /** The child's answers, one for each problem, a blank as null; at least one written. */
  private readAnswers(row: CheckUp, dto: AnswerCheckUpDto): (string | null)[] {
    const problems = row.sheet.problems;
    if (dto.answers.length !== problems.length)
      throw fieldsError({
        answers: `answers must hold ${problems.length} answers, one for each problem (null for a blank)`,
      });
    const answers = blanksAsNull(dto.answers);
    if (answers.every((a) => a === null))
      throw fieldsError({ answers: 'enter at least one of the child’s answers' });
    return answers;
  }

  /**
   * Answers for a check-up already taken: the same answers and sitting details as it was taken
   * with are a repeat, answered as it was but with no misses changed; anything else is refused.
   */
  private async answeredAgain(member: MemberContext, row: CheckUp, dto: AnswerCheckUpDto) {
    const taken = 'this check-up was already taken; make a new one to ask again';
    if (row.reading === null || row.sittingId === null) throw fieldsError({ answers: taken });
    const answers = blanksAsNull(dto.answers);
    const saved = row.reading.answers;
    const sitting = await this.sittings.findModel(member, row.sittingId);
    const same =
      answers.length === saved.length &&
      answers.every((a, i) => a === saved[i]) &&
      sitting.startedAt === readLocalTime(dto.startedAt) &&
      sitting.minutes === (dto.minutes ?? null) &&
      sitting.rested === (dto.conditions?.rested ?? null) &&
      sitting.afterMeal === (dto.conditions?.afterMeal ?? null) &&
      sitting.note === (dto.conditions?.note || null);
    if (!same) throw fieldsError({ answers: taken });
    return { ...this.toJson(row), misses: emptyChanges() };
  }

  async pdf(member: MemberContext, id: number, which: 'sheet' | 'answers') {
    const row = await this.findModel(member, id);
    const student = await this.students.find(member, row.studentId);
    const header = { studentName: student.name, createdOn: row.createdAt.toISOString() };
    const body =
      which === 'sheet'
        ? await childSheetPdf(row.sheet, header)
        : await parentSheetPdf(row.sheet, header);
    return { filename: `check-up-${row.id}-${which}.pdf`, body };
  }

  private async findModel(member: MemberContext, id: number): Promise<CheckUp> {
    const row = await this.checkUpModel.findOne({
      where: { [Op.and]: [this.scope(member), { id }] },
    });
    if (!row) throw new NotFoundException(`No check-up ${id} in this household`);
    return row;
  }

  private toJson(row: CheckUp) {
    const reading = row.reading;
    return {
      id: row.id,
      studentId: row.studentId,
      answerKeyId: row.answerKeyId,
      sittingId: row.sittingId,
      ruleIds: row.ruleIds,
      operation: row.sheet.operation,
      hypotheses: row.sheet.hypotheses.map((h) => ({ id: h, name: hypothesisName(h) })),
      problems: row.sheet.problems,
      merged: row.sheet.merged,
      status: reading === null ? 'not taken' : reading.verdict,
      reading: reading === null ? null : { ...reading, sentence: readingSentence(reading) },
      createdAt: row.createdAt,
    };
  }
}

/** `['12 ', '', null]` → `['12', null, null]`. */
const blanksAsNull = (answers: readonly (string | null)[]) =>
  answers.map((a) => (a === null || a.trim() === '' ? null : a.trim()));
