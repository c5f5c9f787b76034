import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import {
  Injectable,
  Logger,
  type OnApplicationShutdown,
  ServiceUnavailableException,
} from '@nestjs/common';
import type { Patterns } from '@workback/core';
import { Piscina } from 'piscina';
import type { ReviewPlanJson } from '../review-plans/review-plans.service.js';
import type * as tasks from './cpu-tasks.js';

/**
 * Run from TypeScript source (development, tests, benches): the threads need the same loader,
 * told where the API's tsconfig is (it looks in the working directory, which may be the root).
 */
const fromSource = import.meta.url.endsWith('.ts');
/**
 * A thread's flags replace the process's: only the loader's, as V8's (`--trace-gc`, heap sizes)
 * and process-wide ones (`--cpu-prof`) are refused in a thread or would act once per thread.
 */
const SOURCE_FLAGS = [
  '--conditions=workback-source',
  '--import',
  '@swc-node/register/esm-register',
];
const THREADS = Math.max(1, availableParallelism() - 1);
const API_TSCONFIG = fileURLToPath(new URL('../../tsconfig.json', import.meta.url));

/**
 * Worker threads for the CPU-heavy pure work of a request: laying out a plan's PDF and weighing
 * a student's patterns. On the event loop each held every other request for 5–10 ms (with many
 * families at once, most of a request's wait was queueing behind such work); in a thread the
 * loop only sends the input and takes the answer. At most `MAX_QUEUED` tasks wait; past that a
 * request is told to try again (503) rather than the queue growing without end, and so is one
 * whose task is not done within `TASK_LIMIT_MS`.
 */
@Injectable()
export class CpuPool implements OnApplicationShutdown {
  static readonly MAX_QUEUED = 100;
  /**
   * A task still waiting or running after this long is given up (a running one's thread is
   * stopped and another started), and its request answers 503: a thread that cannot start, or
   * a task that never ends, would otherwise hold the request and the queue for ever.
   */
  static readonly TASK_LIMIT_MS = 20_000;
  /** Tests shorten it. */
  taskLimitMs = CpuPool.TASK_LIMIT_MS;
  private readonly pool = new Piscina({
    filename: new URL(`./cpu-tasks${fromSource ? '.ts' : '.js'}`, import.meta.url).href,
    // Not settings: the threads' own copy of the process's flags and environment.
    ...(fromSource && {
      execArgv: SOURCE_FLAGS,
      env: { ...process.env, SWC_NODE_PROJECT: API_TSCONFIG },
    }),
    // Started at the first task and then kept: a thread spends its start loading the PDF and
    // pattern code, which should happen once, not again at each busy spell (piscina's default
    // retires idle threads at once). None starts in a process that never prints or weighs
    // patterns, so none is stopped half-loaded. One core is left to the event loop (and to
    // SQLite's and sharp's threads).
    minThreads: 0,
    maxThreads: THREADS,
    idleTimeout: Infinity,
    maxQueue: CpuPool.MAX_QUEUED,
  });
  private readonly logger = new Logger('CpuPool');

  constructor() {
    // A thread that fails outside a task (it could not load) is replaced at the next task; the
    // pool reports it here instead of ending the process.
    this.pool.on('error', (err: Error) =>
      this.logger.error(`a worker thread failed: ${err.message}`),
    );
  }

  async planPdf(plan: ReviewPlanJson): Promise<Buffer> {
    const pdf = await this.run<Uint8Array>('planPdf', plan);
    return Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength);
  }

  patterns(...input: tasks.PatternsInput): Promise<Patterns> {
    return this.run('patterns', input);
  }

  private async run<T>(name: keyof typeof tasks, input: unknown): Promise<T> {
    if (this.pool.queueSize >= CpuPool.MAX_QUEUED) {
      throw new ServiceUnavailableException(
        'The server is busy printing and weighing patterns: please try again in a moment',
      );
    }
    const signal = AbortSignal.timeout(this.taskLimitMs);
    try {
      return (await this.pool.run(input, { name, signal })) as T;
    } catch (err) {
      if (!signal.aborted) throw err;
      throw new ServiceUnavailableException(
        'Printing or weighing patterns took too long: please try again in a moment',
      );
    }
  }

  async onApplicationShutdown(): Promise<void> {
    await this.pool.destroy();
  }
}
