import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { CheckUpsModule } from '../check-ups/check-ups.module.js';
import { MissesModule } from '../misses/misses.module.js';
import { ReviewPlansModule } from '../review-plans/review-plans.module.js';
import { SittingsModule } from '../sittings/sittings.module.js';
import { StudentsModule } from '../students/students.module.js';
import { WorkersModule } from '../workers/workers.module.js';
import { PatternNote } from './models/pattern-note.model.js';
import { PatternsController } from './patterns.controller.js';
import { PatternsMemo } from './patterns-memo.js';
import { PatternsService } from './patterns.service.js';

@Module({
  imports: [
    SequelizeModule.forFeature([PatternNote]),
    StudentsModule,
    MissesModule,
    SittingsModule,
    ReviewPlansModule,
    CheckUpsModule,
    WorkersModule,
  ],
  controllers: [PatternsController],
  providers: [PatternsService, PatternsMemo],
  exports: [PatternsService],
})
export class PatternsModule {}
