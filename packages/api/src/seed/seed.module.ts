import { Module, type OnApplicationBootstrap } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { AnswerKeysModule } from '../answer-keys/answer-keys.module.js';
import { AuthModule } from '../auth/auth.module.js';
import type { AppConfig } from '../config/app.config.js';
import { CurriculumModule } from '../curriculum/curriculum.module.js';
import { HouseholdsModule } from '../households/households.module.js';
import { MissesModule } from '../misses/misses.module.js';
import { NotesModule } from '../notes/notes.module.js';
import { PhotosModule } from '../photos/photos.module.js';
import { ReviewPlansModule } from '../review-plans/review-plans.module.js';
import { SittingsModule } from '../sittings/sittings.module.js';
import { StudentsModule } from '../students/students.module.js';
import { UsersModule } from '../users/users.module.js';
import { DemoCurriculumSeeder } from './demo-curriculum.js';
import { DemoMissesSeeder } from './demo-misses.js';
import { DemoReviewPlansSeeder } from './demo-review-plans.js';
import { DemoSeeder } from './demo-seeder.js';

@Module({
  imports: [
    AuthModule,
    UsersModule,
    HouseholdsModule,
    StudentsModule,
    MissesModule,
    NotesModule,
    PhotosModule,
    CurriculumModule,
    AnswerKeysModule,
    SittingsModule,
    ReviewPlansModule,
  ],
  providers: [DemoSeeder, DemoMissesSeeder, DemoCurriculumSeeder, DemoReviewPlansSeeder],
  exports: [DemoSeeder],
})
export class SeedModule implements OnApplicationBootstrap {
  constructor(
    private readonly seeder: DemoSeeder,
    private readonly config: ConfigService,
  ) {}

  async onApplicationBootstrap(): Promise<void> {
    if (this.config.getOrThrow<AppConfig>('app').seedDemo) await this.seeder.seedIfEmpty();
  }
}
