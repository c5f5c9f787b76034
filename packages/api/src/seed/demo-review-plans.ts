import { readFile } from 'node:fs/promises';
import { Injectable } from '@nestjs/common';
import type { MemberContext } from '../common/member-context.js';
import { StudentMissesService } from '../misses/student-misses.service.js';
import { ReviewPlanMakingService } from '../review-plans/review-plan-making.service.js';
import { ReviewPlansService } from '../review-plans/review-plans.service.js';
import { StudentsService } from '../students/students.service.js';

export const DEMO_PLANS_FILE = new URL('../../../../seeds/demo-review-plan.json', import.meta.url);

interface DemoPlan {
  student: string;
  scheduledDaysAgo: number;
  missesFromDaysAgo: number;
  missesToDaysAgo: number;
  checkedOff: boolean;
}

/**
 * The demo's past review plan, through the same service a parent uses: it takes the misses
 * of its dates whatever their status (the older demo misses are loaded resolved), and when
 * checked off it leaves them resolved again.
 */
@Injectable()
export class DemoReviewPlansSeeder {
  constructor(
    private readonly students: StudentsService,
    private readonly misses: StudentMissesService,
    private readonly plans: ReviewPlansService,
    private readonly making: ReviewPlanMakingService,
  ) {}

  async seed(owner: MemberContext, today = new Date()): Promise<number> {
    const { plans } = JSON.parse(await readFile(DEMO_PLANS_FILE, 'utf8')) as { plans: DemoPlan[] };
    const day = (daysAgo: number) =>
      new Date(today.getTime() - daysAgo * 86_400_000).toISOString().slice(0, 10);
    const byName = new Map((await this.students.findAll(owner)).items.map((s) => [s.name, s.id]));
    let made = 0;
    for (const p of plans) {
      const studentId = byName.get(p.student);
      if (studentId === undefined) throw new Error(`No demo student ${p.student}`);
      const chosen = await this.misses.withDiagnoses(owner, {
        studentId,
        from: day(p.missesFromDaysAgo),
        to: day(p.missesToDaysAgo),
      });
      if (chosen.length === 0) continue;
      const plan = await this.making.create(owner, {
        studentId,
        scheduledFor: day(p.scheduledDaysAgo),
        missIds: chosen.map((m) => m.id),
      });
      if (p.checkedOff)
        await this.plans.update(owner, plan.id, {
          items: plan.items.map((i) => ({ id: i.id, done: true })),
        });
      made += 1;
    }
    return made;
  }
}
