import 'reflect-metadata';
import { ConfigService } from '@nestjs/config';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module.js';
import { configureApp } from './app.setup.js';
import type { AppConfig } from './config/app.config.js';

/** The whole HTTP app, configured but not listening; main.ts and the API tests both use it. */
export async function createApp(): Promise<{ app: NestExpressApplication; config: AppConfig }> {
  const app = await NestFactory.create<NestExpressApplication>(AppModule, { bufferLogs: true });
  const config = app.get(ConfigService).getOrThrow<AppConfig>('app');
  configureApp(app, config);
  await app.init();
  return { app, config };
}
