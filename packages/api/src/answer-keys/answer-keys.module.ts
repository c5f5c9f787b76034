import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { CurriculumModule } from '../curriculum/curriculum.module.js';
import { UsersModule } from '../users/users.module.js';
import { AnswerKeysController } from './answer-keys.controller.js';
import { AnswerKeysService } from './answer-keys.service.js';
import { KeyCorrectionsService } from './key-corrections.service.js';
import { KeyImportService } from './key-import.service.js';
import { AnswerKey } from './models/answer-key.model.js';
import { KeyCorrection } from './models/key-correction.model.js';
import { KeyItem } from './models/key-item.model.js';

@Module({
  imports: [
    SequelizeModule.forFeature([AnswerKey, KeyItem, KeyCorrection]),
    CurriculumModule,
    UsersModule,
  ],
  controllers: [AnswerKeysController],
  providers: [AnswerKeysService, KeyImportService, KeyCorrectionsService],
  exports: [AnswerKeysService],
})
export class AnswerKeysModule {}
