import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { getConnectionToken } from '@nestjs/sequelize';
import autocannon, { type Request, type Result } from 'autocannon';
import type { Sequelize } from 'sequelize-typescript';
import { createApp } from '../src/app.factory.js';
import { startServerProcess } from '../test/support/server-process.js';
import { report } from './figures.js';
import { fillHousehold } from './household-fill.js';
import { type Session, signIn } from '../test/support/sign-in.js';
import { percentile, table } from './stats.js';

const MISSES = Number(process.env.BENCH_MISSES ?? 100_000);
const SITTINGS = Number(process.env.BENCH_SITTINGS ?? 500);
const DAYS = Number(process.env.BENCH_DAYS ?? 2000);
const DURATION = Number(process.env.BENCH_DURATION ?? 30);
const CONNECTIONS = 50;
const TARGET_P99_MS = 50;
/** This run's rows in the one table: the stress case beside the many-families load. */
const STRESS = `stress: one household of ${MISSES.toLocaleString('en')} misses`;

/** One cycle of 20 requests per connection: 12 lists, 5 opens, 2 saves, 1 patterns. */
const CYCLE = 'LOLLOLSLOLLPLOLSLOLL';
const KINDS = {
  L: 'list misses with filters',
  O: 'open a miss',
  S: 'save a miss',
  P: 'patterns (12 weeks)',
} as const;
type Kind = keyof typeof KINDS;

interface Household {
  householdId: number;
  students: number[];
  missIds: { min: number; max: number };
}

/** A small seeded generator, so every run asks for the same requests. */
function seeded(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = Math.imul(s ^ (s >>> 15), 1 | s);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function daysBefore(today: string, days: number): string {
  return new Date(Date.parse(today) - days * 86_400_000).toISOString().slice(0, 10);
}

/** Seeds the demo household through the app, then grows it to the bench's size. */
async function prepare(env: Record<string, string>, today: string): Promise<Household> {
  Object.assign(process.env, env);
  const { app } = await createApp();
  try {
    const sequelize = app.get<Sequelize>(getConnectionToken());
    const [[owner]] = (await sequelize.query(
      "SELECT m.household_id AS householdId FROM users u JOIN memberships m ON m.user_id = u.id WHERE u.email = 'parent@workback.test'",
    )) as [{ householdId: number }[], unknown];
    const householdId = owner!.householdId;
    const started = Date.now();
    await fillHousehold(sequelize, {
      householdId,
      misses: MISSES,
      sittings: SITTINGS,
      days: DAYS,
      today,
    });
    const [students] = (await sequelize.query(
      'SELECT id FROM students WHERE household_id = ? ORDER BY id',
      { replacements: [householdId] },
    )) as [{ id: number }[], unknown];
    const [[range]] = (await sequelize.query(
      'SELECT MIN(id) AS min, MAX(id) AS max, COUNT(*) AS n FROM misses WHERE household_id = ?',
      { replacements: [householdId] },
    )) as [{ min: number; max: number; n: number }[], unknown];
    console.log(
      `\nfilled the demo household to ${range!.n.toLocaleString('en')} misses and ${SITTINGS} more sittings over ${DAYS} days in ${((Date.now() - started) / 1000).toFixed(1)} s`,
    );
    return { householdId, students: students.map((s) => s.id), missIds: range! };
  } finally {
    await app.close();
  }
}

/** The autocannon requests of one cycle; `onAnswer` hears which kind each answer was. */
function mixRequests(
  h: Household,
  owner: Session,
  today: string,
  onAnswer: (kind: Kind) => void,
): Request[] {
  const random = seeded(2026);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
  const twelveWeeks = daysBefore(today, 84);
  const lists = () => {
    const s = pick(h.students);
    return pick([
      '/api/misses',
      `/api/misses?studentId=${s}`,
      `/api/misses?studentId=${s}&status=logged`,
      `/api/misses?cause=fact&from=${twelveWeeks}`,
      `/api/misses?rule=sub.borrow-across-zero&page=2`,
      `/api/misses?skill=subtraction.regrouping-zeros`,
      `/api/misses?q=zero`,
      `/api/misses?sort=-createdAt&page=3`,
    ]);
  };
  const saves = [
    ['304 - 75', '139', 'I took from the 3 because the zero had nothing.'],
    ['7 x 8', '54', 'I counted up by sevens and lost one.'],
    ['58 + 67', '115', 'I forgot to carry the one.'],
  ] as const;
  const build = (kind: Kind): Request => {
    const answered = () => onAnswer(kind);
    switch (kind) {
      case 'L':
        return {
          method: 'GET',
          setupRequest: (r) => ({ ...r, path: lists() }),
          onResponse: answered,
        };
      case 'O':
        return {
          method: 'GET',
          setupRequest: (r) => ({
            ...r,
            path: `/api/misses/${h.missIds.min + Math.floor(random() * (h.missIds.max - h.missIds.min + 1))}`,
          }),
          onResponse: answered,
        };
      case 'S':
        return {
          method: 'POST',
          headers: {
            cookie: owner.cookie,
            'content-type': 'application/json',
            'x-csrf-token': owner.token,
          },
          setupRequest: (r) => {
            const [problem, answer, explanation] = pick(saves);
            const body = {
              studentId: pick(h.students),
              occurredOn: today,
              problem,
              answer,
              explanation,
              cause: 'step',
            };
            return { ...r, path: '/api/misses', body: JSON.stringify(body) };
          },
          onResponse: answered,
        };
      case 'P':
        return {
          method: 'GET',
          setupRequest: (r) => ({
            ...r,
            path: `/api/patterns?studentId=${pick(h.students)}&from=${twelveWeeks}`,
          }),
          onResponse: answered,
        };
    }
  };
  return [...CYCLE].map((k) => build(k as Kind));
}

interface KindStats {
  times: number[];
  failed: number;
}

async function runMix(base: string, h: Household, owner: Session, today: string) {
  const byKind = new Map<Kind, KindStats>(
    (Object.keys(KINDS) as Kind[]).map((k) => [k, { times: [], failed: 0 }]),
  );
  // autocannon calls a request's onResponse just before it emits 'response' for it.
  let last: Kind = 'L';
  const instance = autocannon({
    url: base,
    connections: CONNECTIONS,
    duration: DURATION,
    headers: { cookie: owner.cookie },
    requests: mixRequests(h, owner, today, (kind) => (last = kind)),
  });
  instance.on('response', (_client, status, _bytes, time) => {
    const stats = byKind.get(last)!;
    stats.times.push(time);
    if (status < 200 || status >= 300) stats.failed += 1;
  });
  const result = await instance;
  return { result, byKind };
}

function latencyRow(name: string, r: Result) {
  return {
    run: name,
    'req/s': Math.round(r.requests.average),
    'p50 ms': r.latency.p50,
    'p97.5 ms': r.latency.p97_5,
    'p99 ms': r.latency.p99,
    errors: r.errors + r.timeouts,
    'non-2xx': r.non2xx,
  };
}

/**
 * The realistic mix against a household of 100,000 misses and 500 more sittings: the real
 * server in its own process (as in production), autocannon in this one, `/api/health` first
 * as the ceiling of the same machine.
 */
export async function benchLoadMix(): Promise<void> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'workback-bench-'));
  const env = {
    NODE_ENV: 'production',
    // Production needs a relay and a public address to start; the mix sends no mail.
    SMTP_URL: 'smtp://127.0.0.1:9',
    PUBLIC_URL: 'http://localhost',
    DATA_DIR: dataDir,
    // Seeded on purpose: the mix signs in as the demo's owner and admin.
    SEED_DEMO: 'true',
    LOG_LEVEL: 'silent',
    ADMIN_EMAILS: 'admin@workback.test',
    SIGN_IN_LIMIT_PER_MINUTE: '1000',
  };
  const today = new Date().toISOString().slice(0, 10);
  try {
    const household = await prepare(env, today);
    const server = await startServerProcess(env);
    try {
      const owner = await signIn(server.url, 'parent@workback.test');
      const admin = await signIn(server.url, 'admin@workback.test');
      const health = await autocannon({
        url: `${server.url}/api/health`,
        connections: CONNECTIONS,
        duration: DURATION,
      });
      const { result: mix, byKind } = await runMix(server.url, household, owner, today);
      const metrics = (await (
        await fetch(`${server.url}/api/admin/metrics`, { headers: { cookie: admin.cookie } })
      ).json()) as {
        sqliteBusy: number;
        requests: Record<string, number>;
        memory: { peakRssBytes: number };
      };
      const peakMb = Math.round(metrics.memory.peakRssBytes / 1024 / 1024);

      table(
        `${CONNECTIONS} connections × ${DURATION} s, ${household.missIds.max - household.missIds.min + 1} miss ids in one household`,
        [latencyRow('GET /api/health (ceiling)', health), latencyRow('mix 60/25/10/5', mix)],
      );
      table(
        'the mix by kind of request',
        [...byKind].map(([kind, s]) => {
          const sorted = [...s.times].sort((a, b) => a - b);
          return {
            kind: KINDS[kind],
            share: `${((s.times.length / Math.max(1, mix.requests.total)) * 100).toFixed(0)}%`,
            'p50 ms': Math.round(percentile(sorted, 50)),
            'p99 ms': Math.round(percentile(sorted, 99)),
            'non-2xx': s.failed,
          };
        }),
      );
      console.log(
        `server: SQLITE_BUSY ${metrics.sqliteBusy}, 5xx ${metrics.requests['5xx']}, peak RSS ${peakMb} MB`,
      );
      const failures = mix.errors + mix.timeouts + mix.non2xx;
      report([
        {
          area: STRESS,
          measure: 'GET /api/health req/s (ceiling)',
          value: `${Math.round(health.requests.average)}`,
        },
        { area: STRESS, measure: 'GET /api/health p99', value: `${health.latency.p99} ms` },
        { area: STRESS, measure: 'mix req/s', value: `${Math.round(mix.requests.average)}` },
        {
          area: STRESS,
          measure: 'mix p50 / p97.5',
          value: `${mix.latency.p50} / ${mix.latency.p97_5} ms`,
        },
        {
          area: STRESS,
          measure: 'mix p99',
          value: `${mix.latency.p99} ms`,
          target: `< ${TARGET_P99_MS} ms`,
          met: mix.latency.p99 < TARGET_P99_MS,
        },
        {
          area: STRESS,
          measure: 'mix errors + non-2xx',
          value: `${failures}`,
          target: '0',
          met: failures === 0,
        },
        {
          area: STRESS,
          measure: 'SQLITE_BUSY (server count)',
          value: `${metrics.sqliteBusy}`,
          target: '0',
          met: metrics.sqliteBusy === 0,
        },
        { area: STRESS, measure: 'server peak RSS', value: `${peakMb} MB` },
        ...[...byKind].map(([kind, s]) => ({
          area: STRESS,
          measure: `${KINDS[kind]} p99`,
          value: `${Math.round(
            percentile(
              [...s.times].sort((a, b) => a - b),
              99,
            ),
          )} ms`,
        })),
      ]);
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
    }
  } finally {
    rmSync(dataDir, { recursive: true, force: true });
  }
}
