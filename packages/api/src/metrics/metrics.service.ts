import { monitorEventLoopDelay, type IntervalHistogram } from 'node:perf_hooks';
import { Injectable, type OnModuleDestroy } from '@nestjs/common';

type StatusClass = '2xx' | '3xx' | '4xx' | '5xx';

/**
 * Process-wide counters for the site operator: how many requests ended in each status class,
 * how often SQLite answered "busy" (writers waited past busy_timeout), and memory. Counts start
 * at zero with the process; nothing here knows whose request it was.
 */
@Injectable()
export class MetricsService implements OnModuleDestroy {
  private readonly startedAt = Date.now();
  private readonly statuses: Record<StatusClass, number> = {
    '2xx': 0,
    '3xx': 0,
    '4xx': 0,
    '5xx': 0,
  };
  private sqliteBusy = 0;
  private storageFaults = 0;
  private readonly loopDelay: IntervalHistogram = monitorEventLoopDelay({ resolution: 20 });

  constructor() {
    this.loopDelay.enable();
  }

  countResponse(status: number): void {
    const kind = `${Math.min(5, Math.max(2, Math.floor(status / 100)))}xx` as StatusClass;
    this.statuses[kind] += 1;
  }

  countSqliteBusy(): void {
    this.sqliteBusy += 1;
  }

  countStorageFault(): void {
    this.storageFaults += 1;
  }

  snapshot() {
    const memory = process.memoryUsage();
    const total = Object.values(this.statuses).reduce((a, b) => a + b, 0);
    return {
      uptimeSeconds: Math.round((Date.now() - this.startedAt) / 1000),
      requests: { total, ...this.statuses },
      sqliteBusy: this.sqliteBusy,
      storageFaults: this.storageFaults,
      memory: {
        rssBytes: memory.rss,
        // ru_maxrss is in KiB on Linux: the highest resident size since the process started.
        peakRssBytes: process.resourceUsage().maxRSS * 1024,
        heapUsedBytes: memory.heapUsed,
      },
      eventLoopDelayMs: {
        p50: this.loopDelay.percentile(50) / 1e6,
        p99: this.loopDelay.percentile(99) / 1e6,
        max: this.loopDelay.max / 1e6,
      },
    };
  }

  onModuleDestroy(): void {
    this.loopDelay.disable();
  }
}
