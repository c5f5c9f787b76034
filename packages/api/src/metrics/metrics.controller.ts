import { Controller, Get } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { AdminOnly } from '../common/decorators/roles.decorator.js';
import { MetricsService } from './metrics.service.js';

@ApiTags('admin')
@Controller('admin/metrics')
export class MetricsController {
  constructor(private readonly metrics: MetricsService) {}

  /** Counters and memory of this server process; no household's data. */
  @AdminOnly()
  @Get()
  show() {
    return this.metrics.snapshot();
  }
}
