import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { DiagnoseModule } from '../diagnose/diagnose.module.js';
import { PhotosModule } from '../photos/photos.module.js';
import { StudentsModule } from '../students/students.module.js';
import { CountCache } from './count-cache.js';
import { MarkedMissesService } from './marked-misses.service.js';
import { MissDiagnosesService } from './miss-diagnoses.service.js';
import { MissPhotosService } from './miss-photos.service.js';
import { MissSearchService } from './miss-search.service.js';
import { MissesController } from './misses.controller.js';
import { MissesService } from './misses.service.js';
import { MissDiagnosis } from './models/miss-diagnosis.model.js';
import { MissRule } from './models/miss-rule.model.js';
import { Miss } from './models/miss.model.js';
import { PageCache } from './page-cache.js';
import { StudentMissesService } from './student-misses.service.js';

@Module({
  imports: [
    SequelizeModule.forFeature([Miss, MissRule, MissDiagnosis]),
    StudentsModule,
    PhotosModule,
    DiagnoseModule,
  ],
  controllers: [MissesController],
  providers: [
    MissesService,
    MissSearchService,
    MissPhotosService,
    MissDiagnosesService,
    MarkedMissesService,
    CountCache,
    PageCache,
    StudentMissesService,
  ],
  exports: [MissesService, MarkedMissesService, StudentMissesService],
})
export class MissesModule {}
