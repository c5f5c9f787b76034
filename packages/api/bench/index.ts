import 'reflect-metadata';
import { benchMissesList } from './misses-list.bench.js';
import { benchPhotoPipeline } from './photo-pipeline.bench.js';

// Figures only; not part of `npm test`. BENCH_DURATION=5 BENCH_MISSES=20000 for a quick run.
const only = process.argv[2];
if (!only || only === 'photos') await benchPhotoPipeline();
if (!only || only === 'list') await benchMissesList();
