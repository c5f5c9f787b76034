import { Controller, Get, UseInterceptors } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiTags } from '@nestjs/swagger';
import { Public } from '../common/decorators/public.decorator.js';
import { JsonOnceInterceptor } from '../common/interceptors/json-once.interceptor.js';
import type { AppConfig } from '../config/app.config.js';
import { DatabaseService } from '../database/database.service.js';

export const API_VERSION = '0.1.0';

@ApiTags('health')
@Controller('health')
export class HealthController {
  /** Always the same answer, so its JSON and ETag are made once (JsonOnceInterceptor). */
  private readonly ok: Readonly<{ status: 'ok'; demo: boolean; version: string }>;

  constructor(
    private readonly database: DatabaseService,
    config: ConfigService,
  ) {
    this.ok = Object.freeze({
      status: 'ok',
      demo: config.getOrThrow<AppConfig>('app').seedDemo,
      version: API_VERSION,
    });
  }

  @Public()
  @Get()
  @UseInterceptors(JsonOnceInterceptor)
  async check() {
    await this.database.ping();
    return this.ok;
  }
}
