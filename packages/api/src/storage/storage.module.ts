import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/app.config.js';
import { LocalPhotoStorage } from './local-photo-storage.js';
import { PHOTO_STORAGE } from './photo-storage.js';
import { S3PhotoStorage } from './s3-photo-storage.js';

@Module({
  providers: [
    {
      provide: PHOTO_STORAGE,
      inject: [ConfigService],
      useFactory: (config: ConfigService) => {
        const app = config.getOrThrow<AppConfig>('app');
        return app.s3 ? new S3PhotoStorage(app.s3) : new LocalPhotoStorage(app.photosDir);
      },
    },
  ],
  exports: [PHOTO_STORAGE],
})
export class StorageModule {}
