import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import autocannon, { type Result } from 'autocannon';
import { startServerProcess } from '../test/support/server-process.js';
import { report } from './figures.js';
import { signIn } from '../test/support/sign-in.js';
import { table } from './stats.js';

const DURATION = Number(process.env.BENCH_PER_REQUEST_SECONDS ?? 6);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 2);
const CONNECTIONS = 20;
const apiRoot = fileURLToPath(new URL('..', import.meta.url));

/** The bare Express app of bare-express.ts in its own process. */
async function startBareExpress() {
  const child = spawn(
    process.execPath,
    ['--import', '@swc-node/register/esm-register', 'bench/bare-express.ts'],
    { cwd: apiRoot, stdio: ['ignore', 'pipe', 'inherit'] },
  );
  const url = await new Promise<string>((resolve, reject) => {
    let out = '';
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const match = /running at (\S+)/.exec(out);
      if (match) resolve(match[1]!);
    });
    child.on('exit', () => reject(new Error(`bare Express exited early:\n${out}`)));
  });
  return { url, stop: () => child.kill('SIGTERM') };
}

async function run(url: string, headers: Record<string, string> = {}): Promise<Result> {
  return autocannon({ url, connections: CONNECTIONS, duration: DURATION, headers });
}

/** Best of ROUNDS, taking turns so a burst of someone else's work hits every subject alike. */
async function bestOf(subjects: Record<string, () => Promise<Result>>) {
  const best: Record<string, Result> = {};
  for (let round = 0; round < ROUNDS; round++) {
    for (const [name, measure] of Object.entries(subjects)) {
      const r = await measure();
      if (r.errors + r.timeouts + r.non2xx > 0) {
        throw new Error(`${name}: ${r.errors} errors, ${r.timeouts} timeouts, ${r.non2xx} non-2xx`);
      }
      if (!best[name] || r.requests.average > best[name].requests.average) best[name] = r;
    }
  }
  return best;
}

/** The server as production runs it, its log lines read and dropped, on the demo household. */
export async function startProductionServer(dataDir: string, nodeArgs: readonly string[] = []) {
  const server = await startServerProcess(
    {
      NODE_ENV: 'production',
      DATA_DIR: dataDir,
      SEED_DEMO: 'true',
      LOG_LEVEL: process.env.BENCH_LOG_LEVEL ?? 'info',
      SIGN_IN_LIMIT_PER_MINUTE: '1000',
      // Production refuses to start without them; nothing is mailed during the bench.
      SMTP_URL: 'smtp://127.0.0.1:9',
      PUBLIC_URL: 'http://localhost',
    },
    nodeArgs,
  );
  // Production writes its log lines to stdout; read and drop them rather than keep them.
  server.child.stdout!.removeAllListeners('data');
  server.child.stderr!.removeAllListeners('data');
  server.child.stdout!.resume();
  server.child.stderr!.resume();
  return server;
}

/**
 * What every request costs: the product's /api/health and a signed-in notebook page (the
 * demo household's first 25 misses; also as a browser asks for it, gzipped) beside a bare
 * Express app answering the same health JSON, all measured in this run. The server runs as in
 * production (NODE_ENV=production, info logs written to a pipe that is read and dropped).
 */
export async function benchPerRequest(): Promise<void> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'workback-bench-'));
  const bare = await startBareExpress();
  const server = await startProductionServer(dataDir);
  try {
    const owner = await signIn(server.url, 'parent@workback.test');
    const best = await bestOf({
      bare: () => run(`${bare.url}/api/health`),
      health: () => run(`${server.url}/api/health`),
      notebook: () => run(`${server.url}/api/misses?page=1`, { cookie: owner.cookie }),
      // As a browser asks over plain http: the page gzipped (no target; beside the plain one).
      'notebook, gzip': () =>
        run(`${server.url}/api/misses?page=1`, {
          cookie: owner.cookie,
          'accept-encoding': 'gzip, deflate',
        }),
    });
    const rate = (r: Result) => Math.round(r.requests.average);
    const share = (r: Result) => rate(r) / Math.max(1, rate(best.bare!));
    const pct = (x: number) => `${Math.round(x * 100)}%`;
    table(
      `per-request cost: ${CONNECTIONS} connections × ${DURATION} s, best of ${ROUNDS}`,
      Object.entries(best).map(([name, r]) => ({
        run: name,
        'req/s': rate(r),
        'of bare': pct(share(r)),
        'p50 ms': r.latency.p50,
        'p99 ms': r.latency.p99,
      })),
    );
    report([
      {
        area: 'per-request',
        measure: 'bare Express GET /api/health req/s',
        value: `${rate(best.bare!)}`,
      },
      {
        area: 'per-request',
        measure: 'GET /api/health req/s',
        value: `${rate(best.health!)} (${pct(share(best.health!))} of bare)`,
        target: '≥ 50% of bare Express',
        met: share(best.health!) >= 0.5,
      },
      {
        area: 'per-request',
        measure: 'signed-in notebook page req/s',
        value: `${rate(best.notebook!)} (${pct(share(best.notebook!))} of bare)`,
        target: '≥ 25% of bare Express',
        met: share(best.notebook!) >= 0.25,
      },
    ]);
  } finally {
    bare.stop();
    server.child.kill('SIGTERM');
    await server.exited;
    rmSync(dataDir, { recursive: true, force: true });
  }
}
