import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { type ServerProcess, startServerProcess } from './support/server-process.js';
import { signIn } from './support/sign-in.js';

const dataDir = mkdtempSync(path.join(tmpdir(), 'workback-shutdown-'));
const workerDataDir = mkdtempSync(path.join(tmpdir(), 'workback-shutdown-'));
afterAll(() => {
  for (const dir of [dataDir, workerDataDir]) rmSync(dir, { recursive: true, force: true });
});

/** The server's exit, or SIGKILL after a minute. */
async function exitOf(server: ServerProcess) {
  const exit = await Promise.race([
    server.exited,
    new Promise<'still running'>((r) => setTimeout(() => r('still running'), 60_000)),
  ]);
  if (exit === 'still running') server.child.kill('SIGKILL');
  return exit;
}

/**
 * A demo server with the parent signed in, and requests for patterns that are each their own
 * task for the worker thread (another student or range): the thread starts at the first, so
 * the rest queue for it.
 */
async function serverWithPatternPaths() {
  const server = await startServerProcess({ DATA_DIR: workerDataDir, SEED_DEMO: 'true' });
  const { cookie } = await signIn(server.url, 'parent@workback.test');
  const get = (p: string, signal: AbortSignal = AbortSignal.timeout(30_000)) =>
    fetch(`${server.url}/api${p}`, { headers: { cookie }, signal });
  const students = (await (await get('/students')).json()) as { items: { id: number }[] };
  const patternPaths = students.items.flatMap((s) =>
    ['2026-01-01', '2026-02-01', '2026-03-01'].map(
      (from) => `/patterns?studentId=${s.id}&from=${from}`,
    ),
  );
  return { server, get, patternPaths };
}

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
    const exit = await exitOf(server);
    expect(exit, server.output()).toEqual({ code: 0, signal: null });
    // Every request either completed with 200 or was never accepted; none was cut off mid-way.
    for (const s of statuses) if (s.status === 'fulfilled') expect(s.value).toBe(200);
    expect(statuses.some((s) => s.status === 'fulfilled')).toBe(true);
    // The last connection to close checkpoints and removes the WAL: the databases were closed.
    expect(existsSync(path.join(dataDir, 'workback.sqlite-wal'))).toBe(false);
    expect(existsSync(path.join(dataDir, 'sessions.sqlite-wal'))).toBe(false);
    // Starting through swc-node compiles src on the fly: slow on a loaded 2-core machine.
  }, 180_000);

  it('lets PDFs and patterns waiting for the worker thread finish on SIGTERM', async () => {
    const { server, get, patternPaths } = await serverWithPatternPaths();
    const plans = (await (await get('/review-plans')).json()) as { items: { id: number }[] };
    expect(plans.items.length).toBeGreaterThan(0);
    // Each plan's PDF its own task too: at SIGTERM most are still queued for the thread.
    const paths = [...patternPaths, ...plans.items.map((p) => `/review-plans/${p.id}/export.pdf`)];
    const inFlight = paths.map((p) => get(p).then((r) => r.status));
    await new Promise((r) => setTimeout(r, 50));
    server.child.kill('SIGTERM');
    const statuses = await Promise.allSettled(inFlight);
    expect(await exitOf(server), server.output()).toEqual({ code: 0, signal: null });
    expect(statuses.map((s) => (s.status === 'fulfilled' ? s.value : 'not answered'))).toEqual(
      paths.map(() => 200),
    );
  }, 180_000);

  it('exits 0 on SIGTERM when the clients waiting on the worker thread have gone', async () => {
    const { server, get, patternPaths } = await serverWithPatternPaths();
    const gone = new AbortController();
    const requests = patternPaths.map((p) => get(p, gone.signal).catch(() => 'gone'));
    await new Promise((r) => setTimeout(r, 50));
    gone.abort();
    await Promise.all(requests);
    server.child.kill('SIGTERM');
    expect(await exitOf(server), server.output()).toEqual({ code: 0, signal: null });
  }, 180_000);
});
