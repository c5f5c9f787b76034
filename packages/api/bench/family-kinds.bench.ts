import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Pool } from 'undici';
import { startServerProcess } from '../test/support/server-process.js';
import {
  familyServerEnv,
  KINDS,
  photoForm,
  prepareFamilies,
  requestDrawer,
  seeded,
  serverNodeArgs,
} from './many-families.bench.js';
import { signIn } from '../test/support/sign-in.js';
import { processCpuMs, table } from './stats.js';

const REQUESTS = Number(process.env.BENCH_KIND_REQUESTS ?? 400);
const WARM_UP = 100;

/**
 * What each request of the many-families mix costs the server alone: one request at a time
 * (closed loop, so no queueing), WARM_UP first, then REQUESTS of each kind, with the server's
 * CPU read from /proc before and after. `main` is the event loop's CPU per request; `all`
 * counts every thread (sharp, SQLite and file syncs on the pool). Run the same data with the
 * code before and after a change, in turn: the machine's own drift is larger than most changes.
 */
export async function benchFamilyKinds(): Promise<void> {
  const kept = process.env.BENCH_DATA_DIR;
  const dataDir = kept || mkdtempSync(path.join(tmpdir(), 'workback-bench-'));
  const env = familyServerEnv(dataDir);
  try {
    const families = await prepareFamilies(env);
    const server = await startServerProcess(env, serverNodeArgs());
    const pool = new Pool(server.url, { connections: 1 });
    try {
      const members = [];
      for (const f of families) members.push({ ...f, ...(await signIn(server.url, f.email)) });
      const { photo } = await photoForm();
      const today = new Date().toISOString().slice(0, 10);
      const rows = [];
      // BENCH_KINDS=SM measures only those.
      const only = process.env.BENCH_KINDS ?? Object.keys(KINDS).join('');
      for (const kind of Object.keys(KINDS).filter((k) =>
        only.includes(k),
      ) as (keyof typeof KINDS)[]) {
        const draw = requestDrawer(members, photo, today, seeded(7), kind);
        const send = async () => {
          const r = draw();
          const res = await pool.request({ ...r, body: r.body ?? null });
          await res.body.arrayBuffer();
          if (res.statusCode >= 300) throw new Error(`${r.method} ${r.path}: ${res.statusCode}`);
        };
        for (let i = 0; i < WARM_UP; i++) await send();
        const before = processCpuMs(server.child.pid!);
        const started = performance.now();
        for (let i = 0; i < REQUESTS; i++) await send();
        const wall = performance.now() - started;
        const after = processCpuMs(server.child.pid!);
        rows.push({
          kind: `${kind} ${KINDS[kind]}`,
          'main ms/req': before && after ? ((after.main - before.main) / REQUESTS).toFixed(1) : '–',
          'all ms/req': before && after ? ((after.all - before.all) / REQUESTS).toFixed(1) : '–',
          'wall ms/req': (wall / REQUESTS).toFixed(1),
        });
      }
      table(`each kind alone, one request at a time, ${REQUESTS} of each`, rows);
    } finally {
      await pool.close();
      server.child.kill('SIGTERM');
      await server.exited;
    }
  } finally {
    if (!kept) rmSync(dataDir, { recursive: true, force: true });
  }
}
