import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AnswerKeysModule } from '../answer-keys/answer-keys.module.js';
import { SittingsModule } from '../sittings/sittings.module.js';
import { StudentsModule } from '../students/students.module.js';
import { CheckUpsController } from './check-ups.controller.js';
import { CheckUpsService } from './check-ups.service.js';
import { CheckUp } from './models/check-up.model.js';

@Module({
  imports: [
    SequelizeModule.forFeature([CheckUp]),
    StudentsModule,
    AnswerKeysModule,
    SittingsModule,
  ],
  controllers: [CheckUpsController],
  providers: [CheckUpsService],
  exports: [CheckUpsService],
})
export class CheckUpsModule {}
