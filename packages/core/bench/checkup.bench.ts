// How often a simulated child is named rightly after one check-up sheet, per operation
// (1,000 seeded trials each; a child follows one explanation and slips on a problem with
// probability 0.05), and how long planning a sheet takes. Run: npm run bench -w packages/core
import { appendFileSync } from 'node:fs';
import { identificationRate } from '../src/checkup/identificationRate.js';
import { planCheckUp } from '../src/checkup/planCheckUp.js';

const OPERATIONS = [
  'addition',
  'subtraction',
  'multiplication',
  'division',
  'rounding',
  'missing',
  'fraction',
  'decimal',
  'time',
];
const figures: object[] = [];
console.log('\ncheck-ups: a simulated child named after one sheet (1,000 trials, slip rate 0.05)');
console.log('operation        named   rate');
for (const operation of OPERATIONS) {
  const r = identificationRate(operation, { trials: 1000, slipRate: 0.05, seed: 2026 });
  console.log(
    `${operation.padEnd(15)} ${String(r.identified).padStart(6)}   ${(r.rate * 100).toFixed(1)}%`,
  );
  figures.push({
    area: 'check-ups',
    measure: `${operation}: child named after one sheet`,
    value: `${(r.rate * 100).toFixed(1)}%`,
    target: '≥ 95%',
    met: r.rate >= 0.95,
  });
}

const times: number[] = [];
for (let seed = 1; seed <= 60; seed += 1) {
  const t0 = process.hrtime.bigint();
  planCheckUp(['sub.borrow-across-zero', 'sub.borrow-from-zero', 'sub.smaller-from-larger'], {
    digits: 3,
    seed,
  });
  times.push(Number(process.hrtime.bigint() - t0) / 1e6);
}
times.sort((a, b) => a - b);
const median = times[Math.floor(times.length / 2)] as number;
console.log(`planning a sheet for three subtraction rules: median ${median.toFixed(1)} ms`);
figures.push({
  area: 'check-ups',
  measure: 'plan a sheet (3 rules, median)',
  value: `${median.toFixed(1)} ms`,
});

if (process.env.BENCH_REPORT) {
  appendFileSync(process.env.BENCH_REPORT, figures.map((f) => `${JSON.stringify(f)}\n`).join(''));
}
