import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { type Transaction, UniqueConstraintError } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { MemberContext } from '../common/member-context.js';
import { placeholders, SqlReader } from '../database/sql-reader.js';
import type { CreateCourseDto } from './dto/create-course.dto.js';
import type { CreateLessonDto } from './dto/create-lesson.dto.js';
import type { UpdateCourseDto } from './dto/update-course.dto.js';
import type { UpdateLessonDto } from './dto/update-lesson.dto.js';
import { Course } from './models/course.model.js';
import { Lesson } from './models/lesson.model.js';

/**
 * Something outside the curriculum that refers to courses or lessons (answer keys do).
 * Each answer is a list of plain descriptions, e.g. `['Review 2 item 4']`; empty when unused.
 */
export interface CurriculumUsage {
  courseUsers(courseId: number): Promise<string[]>;
  lessonUsers(courseId: number, lessonNumber: number): Promise<string[]>;
}

@Injectable()
export class CurriculumService {
  private readonly usages: CurriculumUsage[] = [];

  constructor(
    @InjectModel(Course) private readonly courseModel: typeof Course,
    @InjectModel(Lesson) private readonly lessonModel: typeof Lesson,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly reader: SqlReader,
  ) {}

  /** Modules that refer to lessons register here, so deleting one in use answers 409. */
  registerUsage(usage: CurriculumUsage): void {
    this.usages.push(usage);
  }

  async findAll(member: MemberContext) {
    const courses = await this.courseModel.findAll({
      where: { householdId: member.householdId },
      order: [
        ['name', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    const counts = await this.lessonCounts(courses.map((c) => c.id));
    const items = courses.map((c) => toCourseJson(c, counts.get(c.id) ?? 0));
    return { items, total: items.length };
  }

  async findOne(member: MemberContext, id: number) {
    const course = await this.findCourseModel(member, id);
    const lessons = await this.lessonsOf(course.id);
    return { ...toCourseJson(course, lessons.length), lessons: lessons.map(toLessonJson) };
  }

  /** 404 both for what does not exist and for another household's course. */
  async findCourseModel(member: MemberContext, id: number, transaction?: Transaction) {
    const course = await this.courseModel.findOne({
      where: { id, householdId: member.householdId },
      transaction,
    });
    if (!course) throw new NotFoundException(`No course ${id} in this household`);
    return course;
  }

  async create(member: MemberContext, dto: CreateCourseDto) {
    const course = await this.courseModel.create({
      name: dto.name,
      level: blankToNull(dto.level),
      householdId: member.householdId,
    });
    return toCourseJson(course, 0);
  }

  async update(member: MemberContext, id: number, dto: UpdateCourseDto) {
    const course = await this.findCourseModel(member, id);
    await course.update({
      ...(dto.name !== undefined && { name: dto.name }),
      ...(dto.level !== undefined && { level: blankToNull(dto.level) }),
    });
    return toCourseJson(course, (await this.lessonCounts([id])).get(id) ?? 0);
  }

  async remove(member: MemberContext, id: number): Promise<void> {
    const course = await this.findCourseModel(member, id);
    const users = (await Promise.all(this.usages.map((u) => u.courseUsers(id)))).flat();
    if (users.length > 0) {
      throw new ConflictException(
        `Course “${course.name}” is used by ${listOf(users)}; move or delete those first`,
      );
    }
    await this.sequelize.transaction(async (transaction) => {
      await this.lessonModel.destroy({ where: { courseId: id }, transaction });
      await course.destroy({ transaction });
    });
  }

  async findLessons(member: MemberContext, courseId: number) {
    await this.findCourseModel(member, courseId);
    const items = (await this.lessonsOf(courseId)).map(toLessonJson);
    return { items, total: items.length };
  }

  /**
   * Lesson titles by number for a review plan: from the given courses (the first that has
   * the number wins), or from the household's only course when none is given.
   */
  async lessonTitles(
    member: MemberContext,
    courseIds: readonly number[],
    transaction?: Transaction,
  ): Promise<Record<number, string>> {
    let ids = [...courseIds];
    if (ids.length === 0) {
      const all = await this.courseModel.findAll({
        where: { householdId: member.householdId },
        attributes: ['id'],
        transaction,
      });
      if (all.length !== 1) return {};
      ids = [all[0]!.id];
    }
    // One read for every course (only the household's own), not one per course.
    const lessons = await this.reader.rows<{ courseId: number; number: number; title: string }>(
      `SELECT "l"."course_id" AS "courseId", "l"."number", "l"."title"
       FROM "lessons" AS "l" JOIN "courses" AS "c" ON "c"."id" = "l"."course_id"
       WHERE "c"."household_id" = ? AND "c"."id" IN (${placeholders(ids.length)})`,
      [member.householdId, ...ids],
      transaction,
    );
    // A lesson number two courses share takes the title of the course named first.
    const titles: Record<number, string> = {};
    for (const courseId of ids)
      for (const l of lessons) if (l.courseId === courseId) titles[l.number] ??= l.title;
    return titles;
  }

  /** The lesson numbers of a course, for checking lessons to revisit. */
  async lessonNumbers(courseId: number, transaction?: Transaction): Promise<Set<number>> {
    const lessons = await this.lessonModel.findAll({
      where: { courseId },
      attributes: ['number'],
      transaction,
    });
    return new Set(lessons.map((l) => l.number));
  }

  async createLesson(member: MemberContext, courseId: number, dto: CreateLessonDto) {
    await this.findCourseModel(member, courseId);
    await this.refuseTakenNumber(courseId, dto.number);
    const lesson = await this.lessonModel
      .create({ courseId, number: dto.number, title: dto.title, skills: dto.skills ?? [] })
      .catch(refuseRacedNumber(dto.number));
    return toLessonJson(lesson);
  }

  async updateLesson(member: MemberContext, id: number, dto: UpdateLessonDto) {
    const lesson = await this.findLessonModel(member, id);
    if (dto.number !== undefined && dto.number !== lesson.number) {
      await this.refuseInUse(lesson, 'renumbered');
      await this.refuseTakenNumber(lesson.courseId, dto.number);
    }
    await lesson
      .update({
        ...(dto.number !== undefined && { number: dto.number }),
        ...(dto.title !== undefined && { title: dto.title }),
        ...(dto.skills !== undefined && { skills: dto.skills }),
      })
      .catch(refuseRacedNumber(dto.number ?? lesson.number));
    return toLessonJson(lesson);
  }

  async removeLesson(member: MemberContext, id: number): Promise<void> {
    const lesson = await this.findLessonModel(member, id);
    await this.refuseInUse(lesson, 'deleted');
    await lesson.destroy();
  }

  private async findLessonModel(member: MemberContext, id: number): Promise<Lesson> {
    const lesson = await this.lessonModel.findOne({
      where: { id },
      include: [{ model: Course, where: { householdId: member.householdId }, required: true }],
    });
    if (!lesson) throw new NotFoundException(`No lesson ${id} in this household`);
    return lesson;
  }

  private async refuseInUse(lesson: Lesson, verb: string): Promise<void> {
    const users = (
      await Promise.all(this.usages.map((u) => u.lessonUsers(lesson.courseId, lesson.number)))
    ).flat();
    if (users.length > 0) {
      throw new ConflictException(
        `Lesson ${lesson.number} cannot be ${verb}: it is used by ${listOf(users)}`,
      );
    }
  }

  private async refuseTakenNumber(courseId: number, number: number): Promise<void> {
    const taken = await this.lessonModel.count({ where: { courseId, number } });
    if (taken > 0) throw numberTaken(number);
  }

  private lessonsOf(courseId: number) {
    return this.lessonModel.findAll({ where: { courseId }, order: [['number', 'ASC']] });
  }

  private async lessonCounts(courseIds: number[]): Promise<Map<number, number>> {
    if (courseIds.length === 0) return new Map();
    const rows = (await this.lessonModel.count({
      where: { courseId: courseIds },
      group: ['courseId'],
    })) as unknown as { courseId: number; count: number }[];
    return new Map(rows.map((r) => [r.courseId, r.count]));
  }
}

const numberTaken = (number: number) =>
  new ConflictException({
    message: `Lesson ${number} already exists in this course`,
    fields: { number: `lesson ${number} already exists in this course` },
  });

/**
 * For a lesson write checked by refuseTakenNumber: another request may take the number between
 * the check and the write (two at once), and the unique index (course_id, number) refuses it.
 * That is answered as the check answers, not as the index's generic "course_id in use".
 */
const refuseRacedNumber =
  (number: number) =>
  (err: unknown): never => {
    const clash =
      err instanceof UniqueConstraintError && err.errors.some((e) => e.path === 'number');
    throw clash ? numberTaken(number) : err;
  };

const blankToNull = (value: string | null | undefined) =>
  value === undefined || value === null || value === '' ? null : value;

/** `a`, `a and b`, `a, b and 3 more`. */
function listOf(items: string[]): string {
  const shown = items.slice(0, 5);
  const more = items.length - shown.length;
  if (more > 0) return `${shown.join(', ')} and ${more} more`;
  if (shown.length === 1) return shown[0]!;
  return `${shown.slice(0, -1).join(', ')} and ${shown.at(-1)}`;
}

export function toCourseJson(c: Course, lessonCount: number) {
  return {
    id: c.id,
    name: c.name,
    level: c.level,
    lessonCount,
    createdAt: c.createdAt,
    updatedAt: c.updatedAt,
  };
}

export function toLessonJson(l: Lesson) {
  return {
    id: l.id,
    courseId: l.courseId,
    number: l.number,
    title: l.title,
    skills: l.skills,
    createdAt: l.createdAt,
    updatedAt: l.updatedAt,
  };
}
