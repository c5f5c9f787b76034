// `npm run bench`: every package's benchmark in turn (each prints its own detail), then one
// table of the figures they reported. Figures only: nothing here passes or fails a build.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { availableParallelism, cpus, tmpdir } from 'node:os';
import path from 'node:path';

const dir = mkdtempSync(path.join(tmpdir(), 'workback-bench-report-'));
const report = path.join(dir, 'figures.jsonl');
const env = { ...process.env, BENCH_REPORT: report };

let failed = false;
// The web bench serves the built app (`npm run build` first): a phone on slow 4G in Chromium.
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
