import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { startServerProcess } from './support/server-process.js';

const dataDir = mkdtempSync(path.join(tmpdir(), 'workback-shutdown-'));
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

describe('graceful shutdown', () => {
  it('finishes in-flight requests on SIGTERM, closes the databases and exits 0', async () => {
    const server = await startServerProcess({ DATA_DIR: dataDir, SEED_DEMO: 'true' });
    expect(existsSync(path.join(dataDir, 'workback.sqlite-wal'))).toBe(true);
    // Bounded: a request that connects after the port closed can meet another test's server
    // that took the same port number (an SMTP one never answers HTTP).
    const inFlight = Array.from({ length: 20 }, () =>
      fetch(`${server.url}/api/health`, { signal: AbortSignal.timeout(30_000) }).then(
        (r) => r.status,
      ),
    );
    await new Promise((r) => setTimeout(r, 5));
    server.child.kill('SIGTERM');
    const statuses = await Promise.allSettled(inFlight);
    const exit = await Promise.race([
      server.exited,
      new Promise<'still running'>((r) => setTimeout(() => r('still running'), 60_000)),
    ]);
    if (exit === 'still running') server.child.kill('SIGKILL');
    expect(exit, server.output()).toEqual({ code: 0, signal: null });
    // Every request either completed with 200 or was never accepted; none was cut off mid-way.
    for (const s of statuses) if (s.status === 'fulfilled') expect(s.value).toBe(200);
    expect(statuses.some((s) => s.status === 'fulfilled')).toBe(true);
    // The last connection to close checkpoints and removes the WAL: the databases were closed.
    expect(existsSync(path.join(dataDir, 'workback.sqlite-wal'))).toBe(false);
    expect(existsSync(path.join(dataDir, 'sessions.sqlite-wal'))).toBe(false);
    // Starting through swc-node compiles src on the fly: slow on a loaded 2-core machine.
  }, 180_000);
});
