import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { getConnectionToken } from '@nestjs/sequelize';
import autocannon from 'autocannon';
import type { Sequelize } from 'sequelize-typescript';
import { createApp } from '../src/app.factory.js';
import { table } from './stats.js';

const MISSES = Number(process.env.BENCH_MISSES ?? 100_000);
const DURATION = Number(process.env.BENCH_DURATION ?? 20);
const CONNECTIONS = 50;

/** Fills the demo household with invented misses straight through SQL (the API path is measured, not the seeding). */
export async function fill(
  sequelize: Sequelize,
  householdId: number,
  students: number[],
  userId: number,
) {
  const problems: [string, string, string | null][] = [
    ['304 - 75', '139', 'sub.borrow-across-zero'],
    ['7 x 8', '54', 'mul.fact'],
    ['58 + 67', '115', 'add.no-carry'],
    ['81 - 38', '57', 'sub.smaller-from-larger'],
  ];
  const causes = ['slip', 'fact', 'concept', 'step', 'reading', 'copying', 'unsure'];
  const statuses = ['logged', 'discussed', 'planned', 'resolved'];
  const diagnosis = JSON.stringify({ filler: 'x'.repeat(3800) });
  const now = new Date().toISOString();
  const [maxRows] = (await sequelize.query('SELECT COALESCE(MAX(id), 0) AS base FROM misses')) as [
    { base: number }[],
    unknown,
  ];
  const base = maxRows[0]?.base ?? 0;
  const batch = 500;
  for (let start = 0; start < MISSES; start += batch) {
    await sequelize.transaction(async (transaction) => {
      const rows: string[] = [];
      const rules: string[] = [];
      const diagnoses: string[] = [];
      for (let i = start; i < Math.min(MISSES, start + batch); i++) {
        const id = base + i + 1;
        const [problem, answer, rule] = problems[i % problems.length]!;
        const day = new Date(Date.UTC(2024, 0, 1) + (i % 700) * 86_400_000)
          .toISOString()
          .slice(0, 10);
        rows.push(
          `(${id}, ${householdId}, ${students[i % students.length]}, '${day}', '${problem}', '${answer}', 'take ${i}', '${causes[i % 7]}', '', '${statuses[i % 4]}', '["skill.${i % 9}"]', '[]', 'core', NULL, NULL, 1, '${rule ? `["${rule}"]` : '[]'}', NULL, ${userId}, ${userId}, '${now}', '${now}')`,
        );
        diagnoses.push(`(${id}, '${diagnosis}')`);
        if (rule) rules.push(`(${id}, '${rule}', ${householdId})`);
      }
      await sequelize.query(
        `INSERT INTO misses (id, household_id, student_id, occurred_on, problem, answer, explanation, cause, note, status, skills, revisit, engine_version, not_checked_reason, expected, correct, rule_ids, suggested_cause, created_by, updated_by, created_at, updated_at) VALUES ${rows.join(',')}`,
        { transaction },
      );
      await sequelize.query(
        `INSERT INTO miss_diagnoses (miss_id, diagnosis) VALUES ${diagnoses.join(',')}`,
        {
          transaction,
        },
      );
      if (rules.length) {
        await sequelize.query(
          `INSERT INTO miss_rules (miss_id, rule_id, household_id) VALUES ${rules.join(',')}`,
          {
            transaction,
          },
        );
      }
    });
  }
}

async function signIn(base: string): Promise<string> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const cookie = csrf.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const { token } = (await csrf.json()) as { token: string };
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie },
    body: JSON.stringify({ email: 'parent@workback.test', password: 'workback-demo' }),
  });
  if (login.status !== 200) throw new Error(`sign-in failed: ${login.status}`);
  return login.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

function run(url: string, cookie?: string) {
  return autocannon({
    url,
    connections: CONNECTIONS,
    duration: DURATION,
    headers: cookie ? { cookie } : {},
  });
}

export async function benchMissesList(): Promise<void> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'workback-bench-'));
  Object.assign(process.env, {
    NODE_ENV: 'production',
    DATA_DIR: dataDir,
    SEED_DEMO: 'true',
    LOG_LEVEL: 'silent',
    SIGN_IN_LIMIT_PER_MINUTE: '100',
  });
  const { app } = await createApp();
  try {
    await app.listen(0, '127.0.0.1');
    const base = (await app.getUrl()).replace('[::1]', '127.0.0.1');
    const sequelize = app.get<Sequelize>(getConnectionToken());
    const [[owner]] = (await sequelize.query(
      "SELECT m.household_id AS householdId, u.id AS userId FROM users u JOIN memberships m ON m.user_id = u.id WHERE u.email = 'parent@workback.test'",
    )) as [{ householdId: number; userId: number }[], unknown];
    const [students] = (await sequelize.query('SELECT id FROM students WHERE household_id = ?', {
      replacements: [owner!.householdId],
    })) as [{ id: number }[], unknown];
    const started = Date.now();
    await fill(
      sequelize,
      owner!.householdId,
      students.map((s) => s.id),
      owner!.userId,
    );
    await sequelize.query('ANALYZE');
    console.log(
      `\nfilled ${MISSES.toLocaleString('en')} misses in ${((Date.now() - started) / 1000).toFixed(1)} s`,
    );
    const cookie = await signIn(base);
    const check = await fetch(`${base}/api/misses`, { headers: { cookie } });
    const body = (await check.json()) as { total: number };
    if (check.status !== 200 || body.total < MISSES)
      throw new Error(`list answered ${check.status}`);

    const rows: Record<string, string | number>[] = [];
    for (const [name, url, auth] of [
      ['GET /api/health', `${base}/api/health`, undefined],
      ['GET /api/students (signed-in baseline)', `${base}/api/students`, cookie],
      ['GET /api/misses (page 1, -occurredOn)', `${base}/api/misses`, cookie],
      [
        'GET /api/misses?rule=…&status=…',
        `${base}/api/misses?rule=sub.borrow-across-zero&status=logged&page=3`,
        cookie,
      ],
      ['GET /api/misses?q=take 99', `${base}/api/misses?q=take%2099`, cookie],
    ] as const) {
      const r = await run(url, auth);
      rows.push({
        route: name,
        'req/s': Math.round(r.requests.average),
        'p50 ms': r.latency.p50,
        'p99 ms': r.latency.p99,
        errors: r.errors + r.non2xx,
      });
    }
    table(
      `${CONNECTIONS} connections × ${DURATION} s each, ${MISSES.toLocaleString('en')} misses in one household`,
      rows,
    );
  } finally {
    // Let the last run's in-flight requests finish before the databases close.
    await new Promise((resolve) => setTimeout(resolve, 1000));
    await app.close();
    rmSync(dataDir, { recursive: true, force: true });
  }
}
