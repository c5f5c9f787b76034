import { Worker } from 'node:worker_threads';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { niceByThread } from '../../test/support/thread-nice.js';
import { lowerHelperThreads } from './thread-priority.js';

describe.runIf(process.platform === 'linux')('lowerHelperThreads', () => {
  // Vitest runs this file in a process of its own, on its main thread: the event loop here.
  const mainNice = niceByThread().get(process.pid);
  const stop = lowerHelperThreads(7, 50);
  let worker: Worker | undefined;
  afterAll(async () => {
    stop();
    await worker?.terminate();
  });

  it('makes every thread but the event loop nicer, and leaves the event loop as it was', () => {
    const nice = niceByThread();
    expect(nice.size).toBeGreaterThan(1);
    expect(nice.get(process.pid)).toBe(mainNice);
    for (const [tid, value] of nice)
      if (tid !== process.pid) expect(value, `thread ${tid}`).toBeGreaterThanOrEqual(7);
  });

  it('finds a thread started later at its next look', async () => {
    const before = new Set(niceByThread().keys());
    worker = new Worker('setInterval(() => {}, 1000)', { eval: true });
    await new Promise((resolve) => worker!.once('online', resolve));
    const started = [...niceByThread().keys()].filter((tid) => !before.has(tid));
    expect(started.length).toBeGreaterThan(0);
    await vi.waitFor(() => {
      const nice = niceByThread();
      for (const tid of started) if (nice.has(tid)) expect(nice.get(tid)).toBeGreaterThanOrEqual(7);
    });
    expect(niceByThread().get(process.pid)).toBe(mainNice);
  });
});
