import { Module } from '@nestjs/common';
import { CpuPool } from './cpu-pool.service.js';

/** The app's worker threads, one pool shared by every module that hands work to them. */
@Module({
  providers: [CpuPool],
  exports: [CpuPool],
})
export class WorkersModule {}
