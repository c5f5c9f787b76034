import 'reflect-metadata';
import { benchFamilyKinds } from './family-kinds.bench.js';
import { benchLoadMix } from './load-mix.bench.js';
import { benchManyFamilies } from './many-families.bench.js';
import { benchPerRequest } from './per-request.bench.js';
import { benchPhotoPipeline } from './photo-pipeline.bench.js';
import { benchProfile } from './profile.bench.js';

// Figures only; not part of `npm test`. `npm run bench -w packages/api -- photos|request|load|families`
// runs one; BENCH_DURATION=5 BENCH_MISSES=20000 for a quick load run.
// A DATABASE_URL in the shell names the server the many-families run makes its throwaway
// PostgreSQL database on (bench/postgres.ts); every other bench, and the SQLite runs, stay on SQLite.
if (process.env.DATABASE_URL) {
  process.env.BENCH_DATABASE_URL ??= process.env.DATABASE_URL;
  delete process.env.DATABASE_URL;
}
const only = process.argv[2];
if (!only || only === 'photos') await benchPhotoPipeline();
if (!only || only === 'request') await benchPerRequest();
if (!only || only === 'load') await benchLoadMix();
if (!only || only === 'families') await benchManyFamilies();
// Only when asked: `-- profile health` or `-- profile notebook` prints the hottest frames;
// `-- kinds` prices each kind of the many-families mix alone (family-kinds.bench.ts).
if (only === 'profile') await benchProfile(process.argv[3]);
if (only === 'kinds') await benchFamilyKinds();
