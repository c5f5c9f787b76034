import { Module } from '@nestjs/common';
import { MissesModule } from '../misses/misses.module.js';
import { PhotosModule } from '../photos/photos.module.js';
import { StudentsModule } from '../students/students.module.js';
import { PortfolioController } from './portfolio.controller.js';
import { PortfolioService } from './portfolio.service.js';

@Module({
  imports: [StudentsModule, MissesModule, PhotosModule],
  controllers: [PortfolioController],
  providers: [PortfolioService],
})
export class PortfolioModule {}
