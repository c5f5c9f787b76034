import 'reflect-metadata';
import { ConfigService } from '@nestjs/config';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module.js';
import { configureApp } from './app.setup.js';
import type { AppConfig } from './config/app.config.js';

/** The whole HTTP app, configured but not listening; main.ts and the API tests both use it. */
export async function createApp(): Promise<{ app: NestExpressApplication; config: AppConfig }> {
  // Bodies are parsed by configureApp (requestBodies), only for requests that have one.
  const app = await NestFactory.create<NestExpressApplication>(AppModule, {
    bufferLogs: true,
    bodyParser: false,
  });
  const config = app.get(ConfigService).getOrThrow<AppConfig>('app');
  configureApp(app, config);
  await app.init();
  return { app, config };
}
