import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/app.config.js';
import { LocalPhotoStorage } from './local-photo-storage.js';
import { PHOTO_STORAGE } from './photo-storage.js';

@Module({
  providers: [
    {
      provide: PHOTO_STORAGE,
      inject: [ConfigService],
      useFactory: (config: ConfigService) =>
        new LocalPhotoStorage(config.getOrThrow<AppConfig>('app').photosDir),
    },
  ],
  exports: [PHOTO_STORAGE],
})
export class StorageModule {}
