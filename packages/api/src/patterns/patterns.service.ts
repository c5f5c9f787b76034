import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op } from 'sequelize';
import { CheckUpsService } from '../check-ups/check-ups.service.js';
import type { MemberContext } from '../common/member-context.js';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import { driverDate, SqlReader } from '../database/sql-reader.js';
import { StudentMissesService } from '../misses/student-misses.service.js';
import { ReviewPlansService } from '../review-plans/review-plans.service.js';
import { SittingSummariesService } from '../sittings/sitting-summaries.service.js';
import { StudentsService } from '../students/students.service.js';
import { User } from '../users/models/user.model.js';
import type { CreatePatternNoteDto } from './dto/create-pattern-note.dto.js';
import type { PatternsQuery } from './dto/patterns.query.js';
import { PatternNote } from './models/pattern-note.model.js';
import { patternKeyProblem } from './pattern-key.js';
import { PatternsMemo } from './patterns-memo.js';

@Injectable()
export class PatternsService {
  constructor(
    @InjectModel(PatternNote) private readonly noteModel: typeof PatternNote,
    private readonly students: StudentsService,
    private readonly misses: StudentMissesService,
    private readonly sittings: SittingSummariesService,
    private readonly plans: ReviewPlansService,
    private readonly checkUps: CheckUpsService,
    private readonly memo: PatternsMemo,
    private readonly reader: SqlReader,
  ) {}

  /** One student's patterns over a day range, the maths done by `@workback/core`. */
  async find(member: MemberContext, query: PatternsQuery, today = new Date()) {
    if (query.from && query.to && query.from > query.to)
      throw fieldsError({ to: 'to must be on or after from' });
    const student = await this.students.find(member, query.studentId);
    const range = { from: query.from, to: query.to };
    const [misses, rightItems, plans, notes, checkUpOn] = await Promise.all([
      this.misses.patternMisses(member, { studentId: student.id, ...range }),
      this.sittings.rightItemsOf(member, student.id, range),
      this.plans.coverage(member, student.id),
      this.notesOf(member, student.id),
      this.checkUps.latestOn(member, student.id),
    ]);
    const patterns = await this.memo.compute(misses, {
      rightItems,
      plans,
      asOf: today.toISOString().slice(0, 10),
      ...range,
    });
    return {
      studentId: student.id,
      from: query.from ?? null,
      to: query.to ?? null,
      missCount: misses.length,
      rightItemCount: rightItems.length,
      ...patterns,
      recurring: patterns.recurring.map((r) => ({
        ...r,
        notes: notes.filter((n) => n.patternKey === r.key),
      })),
      difficulties: patterns.difficulties.map((d) => ({
        ...d,
        notes: notes.filter((n) => d.patternKeys.includes(n.patternKey)),
        // What the latest check-up on its rules said (made, taken, settled or still open).
        checkUp: d.ruleIds.length > 0 ? checkUpOn(d.ruleIds) : null,
      })),
      notes,
      caution:
        'These are patterns across the work, to help decide what to review; they do not grade the child.',
    };
  }

  async listNotes(member: MemberContext, studentId: number) {
    const student = await this.students.find(member, studentId);
    const items = await this.notesOf(member, student.id);
    return { items, total: items.length };
  }

  async createNote(member: MemberContext, dto: CreatePatternNoteDto) {
    const problem = patternKeyProblem(dto.patternKey);
    if (problem !== null) throw fieldsError({ patternKey: problem });
    const student = await this.students.find(member, dto.studentId);
    const note = await this.noteModel.create({
      householdId: member.householdId,
      studentId: student.id,
      patternKey: dto.patternKey,
      body: dto.body,
      authorId: member.userId,
    });
    const saved = await this.noteModel.findByPk(note.id, {
      include: [{ model: User, attributes: ['id', 'displayName'] }],
      rejectOnEmpty: true,
    });
    return toPatternNoteJson(saved);
  }

  async removeNote(member: MemberContext, id: number): Promise<void> {
    const note = await this.noteModel.findOne({
      where: { [Op.and]: [this.scope(member), { id }] },
    });
    if (!note) throw new NotFoundException(`No pattern note ${id} in this household`);
    await note.destroy();
  }

  private scope(member: MemberContext) {
    return member.studentIds === null
      ? { householdId: member.householdId }
      : { householdId: member.householdId, studentId: { [Op.in]: member.studentIds } };
  }

  /** The student's notes, oldest first, as plain rows through the driver (every patterns view reads them). */
  private async notesOf(member: MemberContext, studentId: number): Promise<PatternNoteJson[]> {
    if (member.studentIds !== null && !member.studentIds.includes(studentId)) return [];
    const rows = await this.reader.rows<NoteRow>(
      `SELECT "n"."id", "n"."student_id" AS "studentId", "n"."pattern_key" AS "patternKey",
              "n"."body", "n"."created_at" AS "createdAt",
              "u"."id" AS "authorId", "u"."display_name" AS "authorName"
       FROM "pattern_notes" AS "n" LEFT JOIN "users" AS "u" ON "u"."id" = "n"."author_id"
       WHERE "n"."household_id" = ? AND "n"."student_id" = ?
       ORDER BY "n"."created_at", "n"."id"`,
      [member.householdId, studentId],
    );
    return rows.map((r) => ({
      id: r.id,
      studentId: r.studentId,
      patternKey: r.patternKey,
      body: r.body,
      author: r.authorId === null ? null : { id: r.authorId, displayName: r.authorName! },
      createdAt: driverDate(r.createdAt),
    }));
  }
}

interface NoteRow {
  id: number;
  studentId: number;
  patternKey: string;
  body: string;
  createdAt: unknown;
  authorId: number | null;
  authorName: string | null;
}

export type PatternNoteJson = ReturnType<typeof toPatternNoteJson>;

export function toPatternNoteJson(n: PatternNote) {
  return {
    id: n.id,
    studentId: n.studentId,
    patternKey: n.patternKey,
    body: n.body,
    author: n.author ? { id: n.author.id, displayName: n.author.displayName } : null,
    createdAt: n.createdAt,
  };
}
