import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AnswerKeysModule } from '../answer-keys/answer-keys.module.js';
import { MissesModule } from '../misses/misses.module.js';
import { StudentsModule } from '../students/students.module.js';
import { SittingMark } from './models/sitting-mark.model.js';
import { Sitting } from './models/sitting.model.js';
import { SittingsController } from './sittings.controller.js';
import { SittingMarksService } from './sitting-marks.service.js';
import { SittingSummariesService } from './sitting-summaries.service.js';
import { SittingsService } from './sittings.service.js';

@Module({
  imports: [
    SequelizeModule.forFeature([Sitting, SittingMark]),
    StudentsModule,
    AnswerKeysModule,
    MissesModule,
  ],
  controllers: [SittingsController],
  providers: [SittingsService, SittingMarksService, SittingSummariesService],
  exports: [SittingsService, SittingMarksService, SittingSummariesService],
})
export class SittingsModule {}
