import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { AnswerKey } from '../answer-keys/models/answer-key.model.js';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { placeholders, SqlReader } from '../database/sql-reader.js';
import { StudentsService } from '../students/students.service.js';
import type { SittingRangeQuery } from './dto/list-sittings.query.js';
import { Sitting } from './models/sitting.model.js';
import { scoreOf, sumTallies } from './sitting-json.js';
import { SittingsService } from './sittings.service.js';
import { TIME_OF_DAY_BANDS } from './time-of-day.js';

const SUMMARY_CAUTION =
  'A handful of sittings is not evidence: scores move with the material as much as with the hour. The best time of day is the family’s call.';

/** What the sittings say over time: a student's scores by time of day and conditions, and the right items for patterns. */
@Injectable()
export class SittingSummariesService {
  constructor(
    @InjectModel(Sitting) private readonly sittingModel: typeof Sitting,
    private readonly sittings: SittingsService,
    private readonly students: StudentsService,
    private readonly reader: SqlReader,
  ) {}

  async summary(member: MemberContext, studentId: number, query: SittingRangeQuery) {
    const student = await this.students.find(member, studentId);
    const where = this.sittings.listWhere(member, { ...query, studentId });
    const sittings = await this.sittingModel.findAll({
      where,
      include: [AnswerKey],
      order: [
        ['startedAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    const tallies = await this.sittings.tallies(sittings.map((s) => s.id));
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

  /**
   * For the patterns module: the items a student got right in their sittings, with the
   * problem and the answer (the child's when typed, else the key's), by day.
   */
  async rightItemsOf(
    member: MemberContext,
    studentId: number,
    range: { from?: string; to?: string } = {},
  ): Promise<{ occurredOn: string; problem: string; answer: string }[]> {
    if (range.from && range.to && range.from > range.to) {
      throw fieldsError({ to: 'to must be on or after from' });
    }
    if (member.studentIds !== null && !member.studentIds.includes(studentId)) return [];
    // Local times sort as text; the whole `to` day is in (as SittingsService.listWhere).
    const sittings = await this.reader.rows<{
      id: number;
      answerKeyId: number;
      startedAt: string;
    }>(
      `SELECT "id", "answer_key_id" AS "answerKeyId", "started_at" AS "startedAt" FROM "sittings"
       WHERE "household_id" = ? AND "student_id" = ?${range.from ? ' AND "started_at" >= ?' : ''}${range.to ? ' AND "started_at" < ?' : ''}
       ORDER BY "started_at", "id"`,
      [
        member.householdId,
        studentId,
        ...(range.from ? [range.from] : []),
        ...(range.to ? [`${range.to}T99`] : []),
      ],
    );
    if (sittings.length === 0) return [];
    // Hundreds of rows for a term of sittings, read for the maths and never saved: straight
    // through the driver (SqlReader), not as models, every key's items in one read, and that
    // read beside the marks' (both follow from the sittings alone).
    const sittingIds = sittings.map((s) => s.id);
    const keyIds = [...new Set(sittings.map((s) => s.answerKeyId))];
    const [marks, itemRows] = await Promise.all([
      this.reader.rows<{ sittingId: number; keyItemId: number; answer: string | null }>(
        `SELECT "sitting_id" AS "sittingId", "key_item_id" AS "keyItemId", "answer"
         FROM "sitting_marks" WHERE "sitting_id" IN (${placeholders(sittingIds.length)}) AND "correct" = ?
         ORDER BY "id"`,
        [...sittingIds, true],
      ),
      this.reader.rows<{ id: number; prompt: string; answer: string }>(
        `SELECT "id", "prompt", "answer" FROM "key_items"
         WHERE "answer_key_id" IN (${placeholders(keyIds.length)})`,
        keyIds,
      ),
    ]);
    const items = new Map(itemRows.map((item) => [item.id, item]));
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
}
