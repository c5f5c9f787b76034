import { Controller, Get, Res } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { Public } from '../common/decorators/public.decorator.js';
import { jsonOnce } from '../common/responses/json-once.js';
import type { AppConfig } from '../config/app.config.js';
import { DatabaseService } from '../database/database.service.js';

export const API_VERSION = '0.1.0';

@ApiTags('health')
@Controller('health')
export class HealthController {
  /** Always the same answer, so its JSON and ETag are made once (jsonOnce). */
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
  async check(@Res({ passthrough: true }) res: Response) {
    await this.database.ping();
    return jsonOnce(res, this.ok);
  }
}
