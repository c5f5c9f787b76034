import { readFile } from 'node:fs/promises';
import { Injectable, Logger } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Role } from '@workback/core';
import type { Sequelize } from 'sequelize-typescript';
import { AuthService } from '../auth/auth.service.js';
import { PasswordService } from '../auth/password.service.js';
import { HouseholdsService } from '../households/households.service.js';
import { StudentsService } from '../students/students.service.js';
import { User } from '../users/models/user.model.js';
import { UsersService } from '../users/users.service.js';
import { DemoCurriculumSeeder } from './demo-curriculum.js';
import { DemoMissesSeeder } from './demo-misses.js';
import { DemoReviewPlansSeeder } from './demo-review-plans.js';

export const DEMO_FILE = new URL('../../../../seeds/demo-household.json', import.meta.url);

interface DemoScenario {
  password: string;
  household: { name: string };
  owner: { email: string; displayName: string };
  members: { email: string; displayName: string; role: Role; students: string[] }[];
  admin: { email: string; displayName: string };
  students: { name: string; gradeLevel: string }[];
}

/** Loads the invented demo household through the app's own services, into an empty database only. */
@Injectable()
export class DemoSeeder {
  private readonly logger = new Logger(DemoSeeder.name);

  constructor(
    private readonly auth: AuthService,
    private readonly users: UsersService,
    private readonly passwords: PasswordService,
    private readonly households: HouseholdsService,
    private readonly students: StudentsService,
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly demoMisses: DemoMissesSeeder,
    private readonly demoCurriculum: DemoCurriculumSeeder,
    private readonly demoPlans: DemoReviewPlansSeeder,
  ) {}

  async seedIfEmpty(): Promise<boolean> {
    const demo = JSON.parse(await readFile(DEMO_FILE, 'utf8')) as DemoScenario;
    if ((await User.count()) > 0) {
      await this.confirmDemoAddresses(demo);
      return false;
    }
    const owner = await this.auth.register({
      ...demo.owner,
      password: demo.password,
      householdName: demo.household.name,
      adultConfirmed: true,
    });
    // The demo's addresses are invented: its accounts start out confirmed.
    await this.users.markEmailVerified(owner.id);
    const ownerMember = await this.households.resolveMember(owner.id);
    if (!ownerMember) throw new Error('Demo owner has no household');
    const byName = new Map<string, number>();
    for (const s of demo.students) {
      byName.set(s.name, (await this.students.create(ownerMember, s)).id);
    }
    const passwordHash = await this.passwords.hash(demo.password);
    const emailVerifiedAt = new Date();
    await this.sequelize.transaction(async (transaction) => {
      for (const m of demo.members) {
        const user = await this.users.create({ ...m, passwordHash, emailVerifiedAt }, transaction);
        const ids = m.students.map((name) => byName.get(name)!);
        await this.households.addMember(ownerMember.householdId, user.id, m.role, ids, transaction);
      }
      await this.users.create({ ...demo.admin, passwordHash, emailVerifiedAt }, transaction);
    });
    await this.demoMisses.seed(ownerMember.householdId);
    await this.demoCurriculum.seed(ownerMember);
    await this.demoPlans.seed(ownerMember);
    this.logger.log(`Demo household "${demo.household.name}" loaded`);
    return true;
  }

  /** A demo seeded before addresses were confirmed (migration 0009) keeps working as it did. */
  private async confirmDemoAddresses(demo: DemoScenario): Promise<void> {
    // Only where the demo itself was seeded: its owner owns the demo household.
    const owner = await this.users.findByEmail(demo.owner.email);
    const homes = owner ? await this.households.listForUser(owner.id) : [];
    if (!homes.some((h) => h.name === demo.household.name && h.role === 'owner')) return;
    for (const { email } of [demo.owner, ...demo.members, demo.admin]) {
      const user = await this.users.findByEmail(email);
      if (user && !user.emailVerifiedAt) await this.users.markEmailVerified(user.id);
    }
  }
}
