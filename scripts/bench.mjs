// `npm run bench`: the build, then every package's benchmark in turn (each prints its own
// detail), then one table of the figures they reported. Figures only: nothing here passes or
// fails a build.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { availableParallelism, cpus, tmpdir } from 'node:os';
import path from 'node:path';

// The web bench serves the built app (a phone on slow 4G in Chromium): built first, so a fresh
// checkout can bench, and no bench measures an older build than the code beside it.
if (spawnSync('npm', ['run', 'build'], { stdio: 'inherit' }).status !== 0) {
  console.error('\nthe build failed: no benchmark ran');
  process.exit(1);
}

const dir = mkdtempSync(path.join(tmpdir(), 'workback-bench-report-'));
const report = path.join(dir, 'figures.jsonl');
const env = { ...process.env, BENCH_REPORT: report };
// The many-families run goes on PostgreSQL as well, in a throwaway database on the server
// BENCH_DATABASE_URL, TEST_DATABASE_URL or DATABASE_URL names; every other run stays on SQLite.
if (env.DATABASE_URL) {
  env.BENCH_DATABASE_URL ??= env.DATABASE_URL;
  delete env.DATABASE_URL;
}
// Without one, a throwaway cluster when Debian's postgresql is installed (never installed
// here); without that either, the API bench prints that it skipped PostgreSQL.
let cluster;
const initdb = () => {
  try {
    return readdirSync('/usr/lib/postgresql').some((v) =>
      existsSync(`/usr/lib/postgresql/${v}/bin/initdb`),
    );
  } catch {
    return false;
  }
};
if (!env.BENCH_DATABASE_URL && !env.TEST_DATABASE_URL && initdb()) {
  const start = spawnSync('bash', ['scripts/pg-cluster.sh', 'start'], {
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const url = /TEST_DATABASE_URL=(\S+)/.exec(start.stdout ?? '')?.[1];
  cluster = /PG_CLUSTER_DIR=(\S+)/.exec(start.stdout ?? '')?.[1];
  if (start.status === 0 && url) env.BENCH_DATABASE_URL = url;
  else console.error('\nno throwaway PostgreSQL cluster started: the many-families run skips it');
}

let failed = false;
for (const workspace of ['packages/core', 'packages/api', 'packages/web']) {
  const run = spawnSync('npm', ['run', 'bench', '-w', workspace], { stdio: 'inherit', env });
  if (run.status !== 0) {
    console.error(`\nthe ${workspace} benchmark stopped with status ${run.status}`);
    failed = true;
  }
}

let figures = [];
try {
  figures = readFileSync(report, 'utf8')
    .split('\n')
    .filter(Boolean)
    .map((line) => JSON.parse(line));
} catch {
  // No package reported anything.
}
rmSync(dir, { recursive: true, force: true });
if (cluster) spawnSync('bash', ['scripts/pg-cluster.sh', 'stop', cluster], { stdio: 'inherit' });

const verdict = (f) => (f.met === undefined ? '' : f.met ? 'met' : 'NOT met');
console.log(
  `\nWorkback benchmarks — ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC, ` +
    `Node ${process.version}, ${availableParallelism()} cores (${cpus()[0]?.model.trim() ?? 'unknown CPU'})`,
);
console.table(
  figures.map((f) => ({
    area: f.area,
    measure: f.measure,
    value: f.value,
    target: f.target ?? '',
    '': verdict(f),
  })),
);
process.exit(failed ? 1 : 0);
