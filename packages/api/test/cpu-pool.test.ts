import { availableParallelism } from 'node:os';
import { ServiceUnavailableException } from '@nestjs/common';
import { computePatterns, diagnose, type PatternMiss } from '@workback/core';
import { afterAll, describe, expect, it } from 'vitest';
import { CpuPool } from '../src/workers/cpu-pool.service.js';

// Work handed to the worker threads (workers/cpu-pool.service.ts) must answer exactly as it
// would on the event loop, and a full queue must be a 503, not a queue without end.
const pool = new CpuPool();
afterAll(() => pool.onApplicationShutdown());

// An invented child's subtraction misses, diagnosed by the engine as the API stores them.
const misses: PatternMiss[] = [
  ['2026-11-02', '304 - 75', '371'],
  ['2026-11-09', '502 - 38', '574'],
  ['2026-11-16', '400 - 26', '484'],
  ['2026-11-23', '7 x 8', '54'],
].map(([occurredOn, problem, answer], i) => {
  const diagnosis = diagnose(problem!, answer!);
  if (!diagnosis.ok) throw new Error(`${problem}: ${diagnosis.error.message}`);
  return {
    id: i + 1,
    occurredOn: occurredOn!,
    cause: 'step',
    skills: [],
    problem: diagnosis.problem.text,
    answer: answer!,
    diagnosis,
  };
});
const options = {
  rightItems: [{ occurredOn: '2026-11-20', problem: '605 - 48', answer: '557' }],
  asOf: '2026-11-30',
};

describe('the worker threads', () => {
  it('weigh patterns exactly as the event loop would', async () => {
    const fromPool = await pool.patterns(misses, options);
    expect(fromPool).toEqual(computePatterns(misses, options));
    // The right item crossed too: it is weighed against the zero-regrouping rule.
    expect(fromPool.findings.rules[0]).toMatchObject({ explains: 2 });
    expect(fromPool.findings.rules[0]!.contradictions).toHaveLength(1);
  });

  it(`turn work away with a 503 once ${CpuPool.MAX_QUEUED} tasks wait, and finish the rest`, async () => {
    const asked = CpuPool.MAX_QUEUED + availableParallelism() + 10;
    const answers = await Promise.allSettled(
      Array.from({ length: asked }, () => pool.patterns(misses, options)),
    );
    const done = answers.filter((a) => a.status === 'fulfilled');
    const refused = answers.filter((a) => a.status === 'rejected');
    expect(done.length).toBeGreaterThanOrEqual(CpuPool.MAX_QUEUED);
    expect(refused.length).toBeGreaterThanOrEqual(10);
    for (const r of refused) {
      expect(r.reason).toBeInstanceOf(ServiceUnavailableException);
      expect((r.reason as ServiceUnavailableException).getStatus()).toBe(503);
    }
    const expected = computePatterns(misses, options);
    for (const d of done) expect(d.value).toEqual(expected);
    // The queue drained: the pool takes work again.
    expect(await pool.patterns(misses, options)).toEqual(expected);
  });

  it('give up a task not done within its limit with a 503, and work after', async () => {
    const slow = new CpuPool();
    try {
      // The thread starts at the first task, loading the code: far longer than 1 ms.
      slow.taskLimitMs = 1;
      const late = await slow.patterns(misses, options).catch((err: unknown) => err);
      expect(late).toBeInstanceOf(ServiceUnavailableException);
      expect((late as ServiceUnavailableException).getStatus()).toBe(503);
      expect((late as Error).message).toMatch(/took too long/);
      slow.taskLimitMs = CpuPool.TASK_LIMIT_MS;
      expect(await slow.patterns(misses, options)).toEqual(computePatterns(misses, options));
    } finally {
      await slow.onApplicationShutdown();
    }
  });
});
