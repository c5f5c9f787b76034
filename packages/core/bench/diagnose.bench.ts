// Diagnoses per second and median microseconds per diagnosis, for 2-, 3- and 4-digit
// problems of each operation, with the full catalog and pairs; then answers made by a rule
// with one fact slip. Run: npm run bench -w packages/core
import { appendFileSync } from 'node:fs';
import { diagnose } from '../src/index.js';
import { applyRule } from '../src/rules/applyRule.js';
import { parseProblem } from '../src/parse/parseProblem.js';
import { seededRandom } from '../src/practice/seededRandom.js';
import { evaluationCases } from '../src/testing/evaluationCases.js';

const random = seededRandom(2026);
const digitsOf = (n: number): string => {
  let s = String(1 + Math.floor(random() * 9));
  for (let i = 1; i < n; i += 1) s += String(Math.floor(random() * 10));
  return s;
};

type Maker = (d: number) => string;
const makers: Record<string, Maker> = {
  addition: (d) => `${digitsOf(d)} + ${digitsOf(d)}`,
  subtraction: (d) => {
    const a = digitsOf(d);
    const b = digitsOf(d);
    return BigInt(a) >= BigInt(b) ? `${a} - ${b}` : `${b} - ${a}`;
  },
  multiplication: (d) => `${digitsOf(d)} x ${digitsOf(Math.max(1, d - 1))}`,
  division: (d) => `${digitsOf(d)} ÷ ${digitsOf(1)}`,
  rounding: (d) => `round ${digitsOf(d)} to the nearest ${d > 3 ? 'hundred' : 'ten'}`,
  missing: (d) => `? + ${digitsOf(d)} = ${digitsOf(d + 1)}`,
  // Decimals and money: d digits in all, two after the point.
  decimal: (d) => {
    const a = `${digitsOf(Math.max(1, d - 2))}.${digitsOf(2)}`;
    const b = `${digitsOf(Math.max(1, d - 2))}.${digitsOf(1)}`;
    return Number(a) >= Number(b) ? `$${a} - $${b}` : `$${b} - $${a}`;
  },
  time: () => {
    const h = 2 + Math.floor(random() * 9);
    const m = 10 + Math.floor(random() * 40);
    return `${h}:${m} - ${h - 1}:${m + 5 + Math.floor(random() * 10)}`;
  },
};
const ruleFor: Record<string, string> = {
  addition: 'add.no-carry',
  subtraction: 'sub.smaller-from-larger',
  multiplication: 'mul.no-carry',
  division: 'div.remainders-dropped',
  rounding: 'round.truncated',
  missing: 'missing.used-wrong-operation',
  decimal: 'sub.borrow-no-decrement',
  time: 'time.hundred-minutes',
};

/** Problems with a wrong answer (a rule's answer when it differs, else the right answer plus one). */
function cases(kind: string, d: number, n: number): [string, string][] {
  const out: [string, string][] = [];
  while (out.length < n) {
    const text = (makers[kind] as Maker)(d);
    const parsed = parseProblem(text);
    if (!parsed.ok) continue;
    const right = diagnose(text, '0');
    if (!right.ok) continue;
    const wrong = applyRule(ruleFor[kind] as string, parsed.problem).find(
      (a) => a !== right.expected,
    );
    const plusOne = /^\d+$/.test(right.expected)
      ? (BigInt(right.expected) + 1n).toString()
      : right.expected;
    out.push([text, wrong ?? plusOne]);
  }
  return out;
}

const sets = new Map<string, [string, string][]>();
for (const kind of Object.keys(makers))
  for (const d of [2, 3, 4]) sets.set(`${kind} ${d}`, cases(kind, d, 400));
// Warm the whole engine up first, so the first rows are not measured while it compiles.
for (let w = 0; w < 5; w += 1)
  for (const set of sets.values()) for (const [p, a] of set) diagnose(p, a);

const rows: string[] = [];
const figures: object[] = [];
for (const kind of Object.keys(makers)) {
  for (const d of [2, 3, 4]) {
    const set = sets.get(`${kind} ${d}`) as [string, string][];
    const times: number[] = [];
    const cpu0 = process.cpuUsage();
    const start = process.hrtime.bigint();
    for (let rep = 0; rep < 5; rep += 1) {
      for (const [p, a] of set) {
        const t0 = process.hrtime.bigint();
        diagnose(p, a);
        times.push(Number(process.hrtime.bigint() - t0) / 1000);
      }
    }
    const total = Number(process.hrtime.bigint() - start) / 1e9;
    const cpu = process.cpuUsage(cpu0);
    // CPU time of the whole process per diagnosis, garbage-collector threads included.
    const cpuMean = (cpu.user + cpu.system) / times.length;
    times.sort((x, y) => x - y);
    const median = times[Math.floor(times.length / 2)] as number;
    figures.push({
      area: 'engine',
      measure: `diagnose ${kind}, ${d} digits (median)`,
      value: `${median.toFixed(1)} µs`,
      ...(kind === 'subtraction' && d === 4 ? { target: '< 50 µs', met: median < 50 } : {}),
    });
    rows.push(
      `${kind.padEnd(15)} ${String(d).padStart(6)}   ${String(Math.round(times.length / total)).padStart(11)}   ${median.toFixed(1).padStart(9)}   ${cpuMean.toFixed(1).padStart(11)}`,
    );
  }
}
console.log('operation       digits   diagnoses/s   median µs   CPU µs/diag');
for (const r of rows) console.log(r);

// Answers a rule and one fact slip make together: nothing simpler gives them, so the engine
// searches every slip inside every rule's working — its slowest path.
const compounds = evaluationCases(2026, 150).filter((c) => c.kind === 'compound');
console.log('\nrule + one slip answers (2–4 digits)   median µs   slowest 1% µs');
for (const operation of ['addition', 'subtraction', 'multiplication'] as const) {
  const set = compounds.filter((c) => c.operation === operation);
  for (const c of set) diagnose(c.problem, c.answer);
  const times: number[] = [];
  for (let rep = 0; rep < 5; rep += 1)
    for (const c of set) {
      const t0 = process.hrtime.bigint();
      diagnose(c.problem, c.answer);
      times.push(Number(process.hrtime.bigint() - t0) / 1000);
    }
  times.sort((x, y) => x - y);
  const median = times[Math.floor(times.length / 2)] as number;
  const p99 = times[Math.floor(times.length * 0.99)] as number;
  figures.push({
    area: 'engine',
    measure: `diagnose ${operation}, rule + one slip (median)`,
    value: `${median.toFixed(1)} µs`,
  });
  console.log(
    `${operation.padEnd(38)} ${median.toFixed(1).padStart(9)}   ${p99.toFixed(1).padStart(13)}`,
  );
}
// The root `npm run bench` prints these with the other packages' figures in one table.
if (process.env.BENCH_REPORT) {
  appendFileSync(process.env.BENCH_REPORT, figures.map((f) => `${JSON.stringify(f)}\n`).join(''));
}
