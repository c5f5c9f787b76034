import 'reflect-metadata';
import { benchLoadMix } from './load-mix.bench.js';
import { benchPhotoPipeline } from './photo-pipeline.bench.js';

// Figures only; not part of `npm test`. `npm run bench -w packages/api -- photos|load` runs one;
// BENCH_DURATION=5 BENCH_MISSES=20000 for a quick load run.
const only = process.argv[2];
if (!only || only === 'photos') await benchPhotoPipeline();
if (!only || only === 'load') await benchLoadMix();
