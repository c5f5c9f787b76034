import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AnswerKeysModule } from '../answer-keys/answer-keys.module.js';
import { CurriculumModule } from '../curriculum/curriculum.module.js';
import { HouseholdsModule } from '../households/households.module.js';
import { MailModule } from '../mail/mail.module.js';
import { MissesModule } from '../misses/misses.module.js';
import { Student } from '../students/models/student.model.js';
import { StudentsModule } from '../students/students.module.js';
import { UsersModule } from '../users/users.module.js';
import { WorkersModule } from '../workers/workers.module.js';
import { ReviewPlanItemMiss } from './models/review-plan-item-miss.model.js';
import { ReviewPlanItem } from './models/review-plan-item.model.js';
import { ReviewPlan } from './models/review-plan.model.js';
import { PlanPdfCache } from './plan-pdf-cache.js';
import { ReviewPlanExportsService } from './review-plan-exports.service.js';
import { ReviewPlansController } from './review-plans.controller.js';
import { ReviewPlanMakingService } from './review-plan-making.service.js';
import { ReviewPlansService } from './review-plans.service.js';

@Module({
  imports: [
    SequelizeModule.forFeature([ReviewPlan, ReviewPlanItem, ReviewPlanItemMiss, Student]),
    StudentsModule,
    MissesModule,
    AnswerKeysModule,
    CurriculumModule,
    HouseholdsModule,
    UsersModule,
    MailModule,
    WorkersModule,
  ],
  controllers: [ReviewPlansController],
  providers: [ReviewPlansService, ReviewPlanMakingService, ReviewPlanExportsService, PlanPdfCache],
  exports: [ReviewPlansService, ReviewPlanMakingService],
})
export class ReviewPlansModule {}
