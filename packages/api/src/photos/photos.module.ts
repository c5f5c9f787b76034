import { Module, type OnApplicationBootstrap } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { StorageModule } from '../storage/storage.module.js';
import { PhotoMark } from './models/photo-mark.model.js';
import { Photo } from './models/photo.model.js';
import { PhotoPipeline } from './photo-pipeline.service.js';
import { PhotosController } from './photos.controller.js';
import { PhotoFilesService } from './photo-files.service.js';
import { PhotosService } from './photos.service.js';

@Module({
  imports: [SequelizeModule.forFeature([Photo, PhotoMark]), StorageModule],
  controllers: [PhotosController],
  providers: [PhotosService, PhotoFilesService, PhotoPipeline],
  exports: [PhotosService, PhotoFilesService],
})
export class PhotosModule implements OnApplicationBootstrap {
  constructor(private readonly photos: PhotosService) {}

  /** Runs before the demo seeder (SeedModule imports this module), so it never races an upload. */
  async onApplicationBootstrap(): Promise<void> {
    await this.photos.sweepOrphans();
  }
}
