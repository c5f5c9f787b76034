import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { DiagnoseModule } from '../diagnose/diagnose.module.js';
import { PhotosModule } from '../photos/photos.module.js';
import { StudentsModule } from '../students/students.module.js';
import { CountCache } from './count-cache.js';
import { MissesController } from './misses.controller.js';
import { MissesService } from './misses.service.js';
import { MissDiagnosis } from './models/miss-diagnosis.model.js';
import { MissRule } from './models/miss-rule.model.js';
import { Miss } from './models/miss.model.js';

@Module({
  imports: [
    SequelizeModule.forFeature([Miss, MissRule, MissDiagnosis]),
    StudentsModule,
    PhotosModule,
    DiagnoseModule,
  ],
  controllers: [MissesController],
  providers: [MissesService, CountCache],
  exports: [MissesService],
})
export class MissesModule {}
