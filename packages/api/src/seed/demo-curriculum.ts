import { readFile } from 'node:fs/promises';
import { Injectable } from '@nestjs/common';
import { MissStatus, type Cause } from '@workback/core';
import { AnswerKeysService } from '../answer-keys/answer-keys.service.js';
import type { KeyKind } from '../answer-keys/models/answer-key.model.js';
import { addToList } from '../common/add-to-list.js';
import type { MemberContext } from '../common/member-context.js';
import { CurriculumService } from '../curriculum/curriculum.service.js';
import { MissesService } from '../misses/misses.service.js';
import { SittingMarksService } from '../sittings/sitting-marks.service.js';
import { SittingsService } from '../sittings/sittings.service.js';
import { StudentsService } from '../students/students.service.js';

export const DEMO_CURRICULUM_FILE = new URL(
  '../../../../seeds/demo-curriculum.json',
  import.meta.url,
);

interface DemoItem {
  number: number;
  prompt: string;
  answer: string;
  skills: string[];
  revisit: string[];
  facts?: string[];
}

interface DemoCurriculum {
  course: {
    name: string;
    level: string;
    lessons: { number: number; title: string; skills: string[] }[];
  };
  keys: { title: string; kind: KeyKind; lessonNumber?: number; items: DemoItem[] }[];
  missStatus: { resolvedAfterDays: number; discussedAfterDays: number };
  sittings: {
    student: string;
    key: string;
    daysAgo: number;
    time: string;
    minutes: number;
    conditions: { rested?: boolean; afterMeal?: boolean; note?: string };
    wrong: { item: number; answer: string; cause?: Cause }[];
  }[];
}

/** The demo course, keys and weeks of marked sittings, through the same services a parent uses. */
@Injectable()
export class DemoCurriculumSeeder {
  constructor(
    private readonly curriculum: CurriculumService,
    private readonly keys: AnswerKeysService,
    private readonly sittings: SittingsService,
    private readonly marks: SittingMarksService,
    private readonly misses: MissesService,
    private readonly students: StudentsService,
  ) {}

  async seed(owner: MemberContext, today = new Date()): Promise<number> {
    const demo = JSON.parse(await readFile(DEMO_CURRICULUM_FILE, 'utf8')) as DemoCurriculum;
    const course = await this.curriculum.create(owner, {
      name: demo.course.name,
      level: demo.course.level,
    });
    for (const lesson of demo.course.lessons) {
      await this.curriculum.createLesson(owner, course.id, lesson);
    }
    const keys = new Map<string, { id: number; items: { id: number; number: number }[] }>();
    for (const key of demo.keys) {
      keys.set(key.title, await this.keys.create(owner, { ...key, courseId: course.id }));
    }
    const byName = new Map((await this.students.findAll(owner)).items.map((s) => [s.name, s.id]));
    const byStatus = new Map<MissStatus, number[]>();
    for (const s of demo.sittings) {
      const key = keys.get(s.key)!;
      const day = new Date(today.getTime() - s.daysAgo * 86_400_000).toISOString().slice(0, 10);
      const sitting = await this.sittings.create(owner, {
        studentId: byName.get(s.student)!,
        answerKeyId: key.id,
        startedAt: `${day}T${s.time}`,
        minutes: s.minutes,
        conditions: s.conditions,
      });
      const wrong = new Map(s.wrong.map((w) => [w.item, w]));
      const saved = await this.marks.putMarks(owner, sitting.id, {
        marks: key.items.map((item) => ({
          keyItemId: item.id,
          correct: !wrong.has(item.number),
          answer: wrong.get(item.number)?.answer ?? null,
          cause: wrong.get(item.number)?.cause ?? null,
        })),
      });
      // Older misses whose cause is known have been talked through (many since put right).
      const status =
        s.daysAgo > demo.missStatus.resolvedAfterDays
          ? MissStatus.resolved
          : s.daysAgo > demo.missStatus.discussedAfterDays
            ? MissStatus.discussed
            : null;
      if (!status) continue;
      const ids = saved.marks.flatMap((m) =>
        m.missId !== null && wrong.get(m.number ?? 0)?.cause ? [m.missId] : [],
      );
      addToList(byStatus, status, ...ids);
    }
    for (const [status, ids] of byStatus) await this.misses.setStatus(owner, ids, status);
    return demo.sittings.length;
  }
}
