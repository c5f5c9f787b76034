import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { CurriculumController } from './curriculum.controller.js';
import { CurriculumService } from './curriculum.service.js';
import { Course } from './models/course.model.js';
import { Lesson } from './models/lesson.model.js';

@Module({
  imports: [SequelizeModule.forFeature([Course, Lesson])],
  controllers: [CurriculumController],
  providers: [CurriculumService],
  exports: [CurriculumService],
})
export class CurriculumModule {}
