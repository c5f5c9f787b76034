import { Controller, Get } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiTags } from '@nestjs/swagger';
import { Public } from '../common/decorators/public.decorator.js';
import type { AppConfig } from '../config/app.config.js';
import { DatabaseService } from '../database/database.service.js';

export const API_VERSION = '0.1.0';

@ApiTags('health')
@Controller('health')
export class HealthController {
  private readonly demo: boolean;

  constructor(
    private readonly database: DatabaseService,
    config: ConfigService,
  ) {
    this.demo = config.getOrThrow<AppConfig>('app').seedDemo;
  }

  @Public()
  @Get()
  async check() {
    await this.database.ping();
    return { status: 'ok', demo: this.demo, version: API_VERSION };
  }
}
