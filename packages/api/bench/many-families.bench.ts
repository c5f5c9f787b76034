import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { getConnectionToken } from '@nestjs/sequelize';
import autocannon, { type Request, type Result } from 'autocannon';
import sharp from 'sharp';
import type { Sequelize } from 'sequelize-typescript';
import { createApp } from '../src/app.factory.js';
import { startServerProcess } from '../test/support/server-process.js';
import { type Figure, report } from './figures.js';
import { fillFamilies } from './household-fill.js';
import {
  failureSummary,
  type KindStats,
  type LoadRequest,
  noteFailure,
  openLoop,
  type OpenLoopResult,
} from './open-loop.js';
import { throwawayDatabase } from './postgres.js';
import { type Session, signIn } from '../test/support/sign-in.js';
import { percentile, processCpuMs, settle, table } from './stats.js';

const HOUSEHOLDS = Number(process.env.BENCH_FAMILIES ?? 2000);
const MISSES_EACH = Number(process.env.BENCH_FAMILY_MISSES ?? 300);
const MEMBERS = Math.min(HOUSEHOLDS, Number(process.env.BENCH_FAMILY_MEMBERS ?? 200));
const RATES = (process.env.BENCH_RATES ?? '50,100,150,200,300')
  .split(',')
  .map(Number)
  .filter((r) => r > 0);
const SECONDS = Number(process.env.BENCH_RATE_SECONDS ?? 10);
const WARM_UP_SECONDS = Number(process.env.BENCH_WARM_UP_SECONDS ?? 10);
/** BENCH_BURSTS=0 leaves out the autocannon runs kept for comparison. */
const BURSTS = process.env.BENCH_BURSTS !== '0';
const TARGET_P99_MS = 100;
const TARGET_RATE = 150;

/**
 * Drawn from at random: notebook lists 50%, open 20%, log with a photo 10%, patterns 10%, PDF 5%,
 * marks 5%. BENCH_FAMILY_MIX=F (or any string of the kinds' letters) offers another mix, to
 * measure one kind's cost alone.
 */
const CYCLE = process.env.BENCH_FAMILY_MIX ?? 'LOLSLPLOLFLOLSLPLOLM';
export const KINDS = {
  L: 'notebook list (with and without filters)',
  O: 'open a miss',
  S: 'log a miss with a small photo',
  P: 'patterns',
  F: 'a review plan’s PDF',
  M: 'mark a sitting',
} as const;
type Kind = keyof typeof KINDS;
if (![...CYCLE].every((k) => k in KINDS)) {
  throw new Error(`BENCH_FAMILY_MIX takes letters of ${Object.keys(KINDS).join('')}, not ${CYCLE}`);
}

export interface Family {
  email: string;
  students: number[];
  /** Misses of the household, to open; a guessed id could be another household's (a 404). */
  missIds: number[];
  planId: number;
  sitting: { id: number; keyItemIds: number[] };
}

interface Member extends Family, Session {}

/**
 * The database of the many-families load: the demo seeded through the app's services, then
 * HOUSEHOLDS copies of it (fillFamilies). `env` is the server's: pass DATABASE_URL in it to
 * build the same load on PostgreSQL (the fill's SQL is SQLite's today). Returns the first
 * MEMBERS families, the ones the load signs in.
 */
export async function prepareFamilies(env: Record<string, string>): Promise<Family[]> {
  Object.assign(process.env, env);
  const { app } = await createApp();
  try {
    const sequelize = app.get<Sequelize>(getConnectionToken());
    const started = Date.now();
    // A kept BENCH_DATA_DIR already holds the families from an earlier run.
    const [filled] = (await sequelize.query(
      "SELECT COUNT(*) AS n FROM users WHERE email = 'family-1@workback.test'",
    )) as [{ n: number | string }[], unknown];
    if (Number(filled[0]!.n) === 0) {
      await fillFamilies(sequelize, {
        households: HOUSEHOLDS,
        misses: MISSES_EACH,
        diagnosed: MEMBERS,
      });
    }
    const q = async <T>(sql: string, replacements: unknown[] = []) =>
      (await sequelize.query(sql, { replacements }))[0] as T[];
    const [counts] = await q<Record<string, number>>(
      `SELECT (SELECT COUNT(*) FROM households) AS households, (SELECT COUNT(*) FROM misses) AS misses,
       (SELECT COUNT(*) FROM photos) AS photos, (SELECT COUNT(*) FROM sittings) AS sittings,
       (SELECT COUNT(*) FROM sitting_marks) AS marks, (SELECT COUNT(*) FROM review_plans) AS plans`,
    );
    console.log(
      `\nbuilt ${HOUSEHOLDS.toLocaleString('en')} more households in ${((Date.now() - started) / 1000).toFixed(0)} s: ` +
        Object.entries(counts!)
          .map(([k, v]) => `${Number(v).toLocaleString('en')} ${k}`)
          .join(', '),
    );
    const families: Family[] = [];
    for (let i = 1; i <= MEMBERS; i++) {
      const email = `family-${i}@workback.test`;
      const [home] = await q<{ id: number }>(
        'SELECT m.household_id AS id FROM users u JOIN memberships m ON m.user_id = u.id WHERE u.email = ?',
        [email],
      );
      const h = home!.id;
      const students = await q<{ id: number }>(
        'SELECT id FROM students WHERE household_id = ? ORDER BY id',
        [h],
      );
      const missIds = await q<{ id: number }>(
        'SELECT id FROM misses WHERE household_id = ? ORDER BY id LIMIT 300',
        [h],
      );
      const [plan] = await q<{ id: number }>(
        'SELECT id FROM review_plans WHERE household_id = ? LIMIT 1',
        [h],
      );
      const [sitting] = await q<{ id: number }>(
        `SELECT s.id FROM sittings s WHERE s.household_id = ?
         AND EXISTS (SELECT 1 FROM sitting_marks k WHERE k.sitting_id = s.id) ORDER BY s.id LIMIT 1`,
        [h],
      );
      const marks = await q<{ id: number }>(
        'SELECT key_item_id AS id FROM sitting_marks WHERE sitting_id = ? ORDER BY key_item_id',
        [sitting!.id],
      );
      families.push({
        email,
        students: students.map((s) => s.id),
        missIds: missIds.map((m) => m.id),
        planId: plan!.id,
        sitting: { id: sitting!.id, keyItemIds: marks.map((k) => k.id) },
      });
    }
    return families;
  } finally {
    await app.close();
  }
}

/** A small photo as the web form sends it, in a multipart body with the miss's fields. */
export async function photoForm(): Promise<{ boundary: string; head: string; photo: Buffer }> {
  const photo = await sharp({
    create: { width: 320, height: 240, channels: 3, background: { r: 240, g: 238, b: 230 } },
  })
    .jpeg({ quality: 70 })
    .toBuffer();
  return { boundary: 'workbackbenchboundary', head: '', photo };
}

function multipart(boundary: string, fields: Record<string, string>, photo: Buffer): Buffer {
  const parts: Buffer[] = [];
  for (const [name, value] of Object.entries(fields)) {
    parts.push(
      Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`,
      ),
    );
  }
  parts.push(
    Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="photos"; filename="page.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`,
    ),
    photo,
    Buffer.from(`\r\n--${boundary}--\r\n`),
  );
  return Buffer.concat(parts);
}

/** A small seeded generator, so every run asks for the same requests. */
export function seeded(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = Math.imul(s ^ (s >>> 15), 1 | s);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Draws the mix's requests: a kind by its share, a signed-in member, and that member's request. */
export function requestDrawer(
  members: (Family & Session)[],
  photo: Buffer,
  today: string,
  random: () => number,
  cycle: string = CYCLE,
): () => LoadRequest<Kind> {
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
  const from = new Date(Date.parse(today) - 84 * 86_400_000).toISOString().slice(0, 10);
  const boundary = 'workbackbenchboundary';
  const headersOf = (m: Member, extra: Record<string, string> = {}) => ({
    cookie: m.cookie,
    'x-csrf-token': m.token,
    ...extra,
  });
  const requestOf = (kind: Kind, m: Member): LoadRequest<Kind> => {
    const s = pick(m.students);
    switch (kind) {
      case 'L':
        return {
          kind,
          method: 'GET',
          headers: headersOf(m),
          path: pick([
            '/api/misses',
            '/api/misses?page=2',
            `/api/misses?studentId=${s}`,
            `/api/misses?studentId=${s}&status=logged`,
            `/api/misses?cause=fact&from=${from}`,
            `/api/misses?rule=sub.borrow-across-zero`,
            `/api/misses?q=zero`,
            `/api/misses?sort=-createdAt&page=3`,
          ]),
        };
      case 'O':
        return {
          kind,
          method: 'GET',
          headers: headersOf(m),
          path: `/api/misses/${pick(m.missIds)}`,
        };
      case 'S': {
        const [problem, answer, explanation] = pick([
          ['304 - 75', '139', 'I took from the 3 because the zero had nothing.'],
          ['7 x 8', '54', 'I counted up by sevens and lost one.'],
          ['58 + 67', '115', 'I forgot to carry the one.'],
        ] as const);
        return {
          kind,
          method: 'POST',
          path: '/api/misses',
          headers: headersOf(m, { 'content-type': `multipart/form-data; boundary=${boundary}` }),
          body: multipart(
            boundary,
            {
              studentId: String(s),
              occurredOn: today,
              problem,
              answer,
              explanation,
              cause: 'step',
            },
            photo,
          ),
        };
      }
      case 'P':
        return {
          kind,
          method: 'GET',
          headers: headersOf(m),
          path: `/api/patterns?studentId=${s}&from=${from}`,
        };
      case 'F':
        return {
          kind,
          method: 'GET',
          headers: headersOf(m),
          path: `/api/review-plans/${m.planId}/export.pdf`,
        };
      case 'M':
        return {
          kind,
          method: 'PUT',
          path: `/api/sittings/${m.sitting.id}/marks`,
          headers: headersOf(m, { 'content-type': 'application/json' }),
          body: JSON.stringify({
            marks: m.sitting.keyItemIds.map((keyItemId) => ({ keyItemId, correct: true })),
          }),
        };
    }
  };
  return () => requestOf(cycle[Math.floor(random() * cycle.length)] as Kind, pick(members));
}

/**
 * autocannon at `overallRate`, as the issue first measured it. Its connections send together
 * when their one-second timers reset, so this load comes as a burst each second; kept beside the
 * open-loop figures for comparison. One request entry draws its request at each send, and the
 * kind rides in the connection's context.
 */
async function burstsAt(base: string, rate: number, draw: () => LoadRequest<Kind>) {
  const byKind = new Map<Kind, KindStats>(
    (Object.keys(KINDS) as Kind[]).map((k) => [k, { times: [], failed: 0 }]),
  );
  let last: Kind = 'L';
  const requests: Request[] = [
    {
      setupRequest: (r: Request, context: object) => {
        const { kind, method, path, headers, body } = draw();
        (context as { kind?: Kind }).kind = kind;
        return { ...r, method, path, headers, body: body as string | undefined };
      },
      onResponse: (_status: number, _body: string, context: object) =>
        (last = (context as { kind: Kind }).kind),
    },
  ];
  const instance = autocannon({
    url: base,
    connections: Math.min(100, rate),
    overallRate: rate,
    duration: SECONDS,
    requests,
  });
  instance.on('response', (_client, status, _bytes, time) => {
    const stats = byKind.get(last)!;
    stats.times.push(time);
    if (status < 200 || status >= 300) noteFailure(stats, String(status));
  });
  const result: Result = await instance;
  const times = [...byKind.values()].flatMap((k) => k.times).sort((a, b) => a - b);
  return {
    sent: result.requests.total,
    answered: times.length,
    unanswered: 0,
    byKind,
    times,
    errors: result.errors + result.non2xx,
  } satisfies OpenLoopResult<Kind>;
}

/** How the offered rate arrives: open loop (the target's), or autocannon's bursts. */
type Load = 'open loop' | 'autocannon bursts';

interface RateResult {
  rate: number;
  load: Load;
  run: OpenLoopResult<Kind>;
  /** The server's CPU over the run, where /proc tells it: main thread and all threads, ms. */
  cpu?: { main: number; all: number };
}

/** SQLite in DATA_DIR, or PostgreSQL behind DATABASE_URL: the same fill, server and mix. */
interface Database {
  name: 'SQLite' | 'PostgreSQL';
  env: Record<string, string>;
}

/** The server's settings for the families benches: production, with limits out of the way. */
export function familyServerEnv(dataDir: string): Record<string, string> {
  return {
    NODE_ENV: 'production',
    DATA_DIR: dataDir,
    SEED_DEMO: 'true',
    LOG_LEVEL: 'silent',
    SIGN_IN_LIMIT_PER_MINUTE: '100000',
    PHOTO_DECODES_PER_MEMBER: '100000',
    // Production refuses to start without them; nothing is mailed during the bench.
    SMTP_URL: 'smtp://127.0.0.1:9',
    PUBLIC_URL: 'http://localhost',
    DATABASE_URL: '',
  };
}

/**
 * The server's node flags: BENCH_CPU_PROF_DIR has it write a .cpuprofile there when it stops;
 * BENCH_SERVER_NODE_ARGS adds any others (`--trace-gc`, heap sizes).
 */
export function serverNodeArgs(): string[] {
  const profileDir = process.env.BENCH_CPU_PROF_DIR;
  return [
    ...(profileDir ? ['--cpu-prof', `--cpu-prof-dir=${profileDir}`] : []),
    ...(process.env.BENCH_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean),
  ];
}

/** One database's run: the fill, the sign-ins, then the mix at each offered rate. */
async function familiesOn(db: Database): Promise<RateResult[]> {
  // BENCH_DATA_DIR keeps the filled database between runs (it is not removed at the end).
  const kept = process.env.BENCH_DATA_DIR;
  const dataDir = kept || mkdtempSync(path.join(tmpdir(), 'workback-bench-'));
  const env = { ...familyServerEnv(dataDir), ...db.env };
  const today = new Date().toISOString().slice(0, 10);
  console.log(`\nmany families on ${db.name}:`);
  try {
    const families = await prepareFamilies(env);
    const server = await startServerProcess(env, serverNodeArgs());
    try {
      const members: Member[] = [];
      for (const f of families) members.push({ ...f, ...(await signIn(server.url, f.email)) });
      const { photo } = await photoForm();
      const random = seeded(2026);
      const draw = requestDrawer(members, photo, today, random);
      const kinds = Object.keys(KINDS) as Kind[];
      // A warm-up, not counted: the first PDF loads its fonts, the first photo starts sharp,
      // and each household's first reads fill the caches a parent's later visits find.
      await openLoop({
        url: server.url,
        rate: 20,
        seconds: WARM_UP_SECONDS,
        random,
        next: draw,
        kinds,
      });
      const results: RateResult[] = [];
      for (const rate of RATES) {
        const runs: [Load, () => Promise<OpenLoopResult<Kind>>][] = [
          [
            'open loop',
            () =>
              openLoop({
                url: server.url,
                rate,
                seconds: SECONDS,
                random,
                next: draw,
                kinds,
              }),
          ],
        ];
        if (BURSTS) runs.push(['autocannon bursts', () => burstsAt(server.url, rate, draw)]);
        for (const [load, go] of runs) {
          await settle(server.child.pid!);
          const before = processCpuMs(server.child.pid!);
          const run = await go();
          const after = processCpuMs(server.child.pid!);
          const cpu =
            before && after
              ? { main: after.main - before.main, all: after.all - before.all }
              : undefined;
          results.push({ rate, load, run, cpu });
          console.log(
            `  ${rate} req/s offered (${load}): p99 ${Math.round(percentile(run.times, 99))} ms, ` +
              `${run.errors} errors or unanswered`,
          );
          const failures = failureSummary(run.byKind);
          if (failures) console.log(`    failed: ${failures}`);
        }
      }
      return results;
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
    }
  } finally {
    if (!kept) rmSync(dataDir, { recursive: true, force: true });
  }
}

function row(database: string, { rate, load, run, cpu }: RateResult) {
  return {
    database,
    load,
    offered: rate,
    'answered/s': Math.round(run.answered / SECONDS),
    // The event loop's CPU per answer, and how busy the server kept the machine's cores.
    'main ms/req': cpu && run.answered ? (cpu.main / run.answered).toFixed(1) : '–',
    'server CPU %': cpu ? Math.round(cpu.all / (10 * SECONDS)) : '–',
    'p50 ms': Math.round(percentile(run.times, 50)),
    'p99 ms': Math.round(percentile(run.times, 99)),
    'errors, unanswered': `${run.errors - run.unanswered}, ${run.unanswered}`,
    ...Object.fromEntries(
      [...run.byKind].map(([k, s]) => [
        `${k} p99`,
        Math.round(
          percentile(
            [...s.times].sort((a, b) => a - b),
            99,
          ),
        ),
      ]),
    ),
  };
}

function figuresOf(database: string, results: RateResult[]): Figure[] {
  // A rate is kept only if (nearly) all it offered was answered: a server too slow to answer
  // at all has no slow answers and no errors either.
  const passes = ({ rate, run }: RateResult) =>
    percentile(run.times, 99) <= TARGET_P99_MS &&
    run.errors === 0 &&
    run.answered >= 0.9 * rate * SECONDS;
  const area = `many families, ${database}`;
  return (['open loop', 'autocannon bursts'] as const).flatMap((load): Figure[] => {
    const of = results.filter((r) => r.load === load);
    if (of.length === 0) return [];
    const best = Math.max(0, ...of.filter(passes).map((r) => r.rate));
    const at100 = of.find((r) => r.rate === 100)?.run;
    return [
      {
        area,
        measure: `${load}: highest offered req/s with p99 ≤ ${TARGET_P99_MS} ms, 0 errors, ≥ 90% answered`,
        value: best ? `${best}` : `none of ${RATES.join(', ')}`,
        // The target is the open loop's; the bursts are shown for comparison.
        ...(load === 'open loop' ? { target: `≥ ${TARGET_RATE}`, met: best >= TARGET_RATE } : {}),
      },
      {
        area,
        measure: `${load}: p99 at 100 req/s offered`,
        value: !at100
          ? 'not run'
          : at100.answered === 0
            ? 'no answers'
            : `${Math.round(percentile(at100.times, 99))} ms (${Math.round((100 * at100.answered) / (100 * SECONDS))}% answered)`,
      },
    ];
  });
}

/**
 * Many families on one machine: HOUSEHOLDS households of MISSES_EACH misses each, MEMBERS of
 * them signed in, an open-loop mix at each offered rate of BENCH_RATES (Poisson arrivals; then
 * autocannon's overallRate for comparison), each for BENCH_RATE_SECONDS — on SQLite, then on PostgreSQL in a throwaway
 * database on the server BENCH_DATABASE_URL, TEST_DATABASE_URL or DATABASE_URL names (skipped,
 * saying so, without one). BENCH_FAMILY_DATABASES=sqlite or =postgres runs one of them.
 */
export async function benchManyFamilies(): Promise<void> {
  const wanted = (process.env.BENCH_FAMILY_DATABASES ?? 'sqlite,postgres').toLowerCase().split(',');
  const rows: ReturnType<typeof row>[] = [];
  const figures: Figure[] = [];
  if (wanted.includes('sqlite')) {
    const results = await familiesOn({ name: 'SQLite', env: {} });
    rows.push(...results.map((r) => row('SQLite', r)));
    figures.push(...figuresOf('SQLite', results));
  }
  if (wanted.includes('postgres')) {
    const pg = await throwawayDatabase('workback_bench');
    if ('skipped' in pg) {
      console.log(`\nmany families on PostgreSQL: skipped — ${pg.skipped}`);
      figures.push({ area: 'many families, PostgreSQL', measure: 'skipped', value: pg.skipped });
    } else {
      try {
        const results = await familiesOn({ name: 'PostgreSQL', env: { DATABASE_URL: pg.url } });
        rows.push(...results.map((r) => row('PostgreSQL', r)));
        figures.push(...figuresOf('PostgreSQL', results));
      } finally {
        await pg.drop();
      }
    }
  }
  if (rows.length)
    table(
      `many families: ${HOUSEHOLDS.toLocaleString('en')} households × ${MISSES_EACH} misses, ${MEMBERS} signed in, ${SECONDS} s per offered rate (req/s); p99 per kind: ${Object.entries(
        KINDS,
      )
        .map(([k, v]) => `${k} ${v}`)
        .join(', ')}`,
      rows,
    );
  // The headline figures of both databases side by side (a skipped one says why).
  const measures = [...new Set(figures.map((f) => f.measure))].filter((m) => m !== 'skipped');
  const databases = ['SQLite', 'PostgreSQL'].filter((db) =>
    figures.some((f) => f.area.endsWith(db)),
  );
  if (measures.length) {
    table(
      'many families, the two databases side by side',
      measures.map((measure) => ({
        measure,
        ...Object.fromEntries(
          databases.map((db) => {
            const of = figures.filter((f) => f.area.endsWith(db));
            return [db, of.find((f) => f.measure === measure)?.value ?? of[0]?.value ?? 'not run'];
          }),
        ),
      })),
    );
  }
  report([
    ...figures,
    {
      area: 'many families',
      measure: 'households × misses, members signed in',
      value: `${HOUSEHOLDS} × ${MISSES_EACH}, ${MEMBERS}`,
    },
  ]);
}
