import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { startProductionServer } from './per-request.bench.js';
import { signIn } from '../test/support/sign-in.js';

const SECONDS = Number(process.env.BENCH_PROFILE_SECONDS ?? 6);
const TOP = 15;

interface CpuProfile {
  nodes: { id: number; callFrame: { functionName: string; url: string; lineNumber: number } }[];
  samples: number[];
  timeDeltas: number[];
}

/** Where a frame's code lives: a package's name, a file of ours, or V8's own work. */
function placeOf(url: string, name: string): string {
  const inPackage = /node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(url);
  if (inPackage) return inPackage[1]!;
  if (url.startsWith('node:')) return url;
  if (!url) return name || '(native)';
  return `src/${url.split('/src/').at(-1)}`;
}

/** Self time by frame and by place, over the samples taken while the load ran. */
export function hottest(profile: CpuProfile, windowMs: number) {
  const byId = new Map(profile.nodes.map((n) => [n.id, n.callFrame]));
  const frames = new Map<string, number>();
  const places = new Map<string, number>();
  const total = profile.timeDeltas.reduce((a, b) => a + b, 0);
  // The last samples are the shutdown; the load ran in the window before it.
  const from = total - (windowMs + 300) * 1000;
  const to = total - 300 * 1000;
  let at = 0;
  let counted = 0;
  profile.samples.forEach((id, i) => {
    const delta = profile.timeDeltas[i]!;
    at += delta;
    if (at < from || at > to) return;
    counted += delta;
    const frame = byId.get(id)!;
    const place = placeOf(frame.url, frame.functionName);
    const key = `${frame.functionName || '(anonymous)'} · ${place}`;
    frames.set(key, (frames.get(key) ?? 0) + delta);
    places.set(place, (places.get(place) ?? 0) + delta);
  });
  const top = (m: Map<string, number>) =>
    [...m]
      .sort((a, b) => b[1] - a[1])
      .slice(0, TOP)
      .map(([name, t]) => ({ name, 'self %': ((100 * t) / counted).toFixed(1) }));
  return { frames: top(frames), places: top(places) };
}

/**
 * `npm run bench -w packages/api -- profile [health|notebook]`: the production server under
 * 20 connections with node --cpu-prof, then the hottest frames and packages by self time.
 * A diagnosis tool for issue-sized questions ("where does a request's time go?"), not a figure.
 */
export async function benchProfile(which = 'notebook'): Promise<void> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'workback-bench-'));
  const profiles = path.join(dataDir, 'profiles');
  const server = await startProductionServer(dataDir, ['--cpu-prof', `--cpu-prof-dir=${profiles}`]);
  try {
    const headers: Record<string, string> = {};
    if (which === 'notebook') {
      headers.cookie = (await signIn(server.url, 'parent@workback.test')).cookie;
    }
    const url =
      which === 'notebook' ? `${server.url}/api/misses?page=1` : `${server.url}/api/health`;
    const result = await autocannon({ url, connections: 20, duration: SECONDS, headers });
    server.child.kill('SIGINT');
    await server.exited;
    // The main thread's profile is the largest; workers (the module loader) write small ones.
    const files = readdirSync(profiles).map((f) => path.join(profiles, f));
    const main = files.sort((a, b) => readFileSync(b).length - readFileSync(a).length)[0]!;
    const { frames, places } = hottest(JSON.parse(readFileSync(main, 'utf8')), SECONDS * 1000);
    console.log(`\n${which}: ${Math.round(result.requests.average)} req/s under --cpu-prof`);
    console.log('hottest frames (self time while the load ran)');
    console.table(frames);
    console.log('by package or file');
    console.table(places);
  } finally {
    server.child.kill('SIGTERM');
    await server.exited;
    rmSync(dataDir, { recursive: true, force: true });
  }
}
