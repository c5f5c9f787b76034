import type { Sequelize } from 'sequelize-typescript';
import { mergeSearchIndex } from '../src/database/search-index.js';

export interface FillOptions {
  householdId: number;
  misses: number;
  sittings: number;
  /** Spread over this many days up to `today`. */
  days: number;
  today: string;
}

const MISS_COLUMNS = [
  'household_id',
  'student_id',
  'occurred_on',
  'sitting_id',
  'key_item_id',
  'problem',
  'answer',
  'steps',
  'explanation',
  'cause',
  'note',
  'status',
  'skills',
  'revisit',
  'engine_version',
  'not_checked_reason',
  'expected',
  'correct',
  'rule_ids',
  'facts',
  'suggested_cause',
  'created_by',
  'updated_by',
  'created_at',
  'updated_at',
];

const SITTING_COLUMNS = [
  'household_id',
  'student_id',
  'answer_key_id',
  'started_at',
  'time_of_day',
  'minutes',
  'rested',
  'after_meal',
  'note',
  'created_at',
  'updated_at',
];

/** Columns copied from the template row `t`, with the ones given here computed per copy. */
function select(columns: string[], computed: Record<string, string>): string {
  return columns.map((c) => computed[c] ?? `t.${c}`).join(', ');
}

/**
 * Grows the demo household to a big notebook by copying its own rows — misses made by the
 * app's services, with their diagnoses, rules, skills and the children's words, and sittings
 * with their marks — onto new dates spread over `days`. Pure SQL, so seeding 100,000 misses
 * takes seconds, while every copied value is one the app itself wrote.
 */
export async function fillHousehold(sequelize: Sequelize, o: FillOptions): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const run = (sql: string, replacements: Record<string, unknown> = {}) =>
      sequelize.query(sql, { transaction, replacements });
    const base = async (table: string) =>
      (
        (await run(`SELECT COALESCE(MAX(id), 0) AS id FROM ${table}`)) as [
          { id: number }[],
          unknown,
        ]
      )[0][0]!.id;
    const series = (n: number) =>
      `WITH RECURSIVE n(i) AS (SELECT 0 UNION ALL SELECT i + 1 FROM n WHERE i < ${n - 1})`;
    const day = `date(:today, '-' || (n.i * :days / :count) || ' days')`;

    await run(
      `CREATE TEMP TABLE tmpl AS SELECT row_number() OVER (ORDER BY id) - 1 AS rn, * FROM misses
       WHERE household_id = :household AND sitting_id IS NULL`,
      { household: o.householdId },
    );
    const templates = await count(run, 'tmpl');
    const missBase = await base('misses');
    await run(
      `${series(o.misses)}
       INSERT INTO misses (${MISS_COLUMNS.join(', ')})
       SELECT ${select(MISS_COLUMNS, {
         occurred_on: day,
         status: `CASE n.i % 4 WHEN 0 THEN 'logged' WHEN 1 THEN 'discussed' WHEN 2 THEN 'planned' ELSE 'resolved' END`,
         created_at: `datetime(${day}, '+18 hours')`,
         updated_at: `datetime(${day}, '+18 hours')`,
       })}
       FROM n JOIN tmpl t ON t.rn = n.i % :templates`,
      { today: o.today, days: o.days, count: o.misses, templates },
    );
    const copyOf = `JOIN tmpl t ON t.rn = (m.id - :base - 1) % :templates`;
    await run(
      `INSERT INTO miss_diagnoses (miss_id, diagnosis)
       SELECT m.id, d.diagnosis FROM misses m ${copyOf} JOIN miss_diagnoses d ON d.miss_id = t.id
       WHERE m.id > :base`,
      { base: missBase, templates },
    );
    await run(
      `INSERT INTO miss_rules (miss_id, rule_id, household_id)
       SELECT m.id, r.rule_id, r.household_id FROM misses m ${copyOf}
       JOIN miss_rules r ON r.miss_id = t.id WHERE m.id > :base`,
      { base: missBase, templates },
    );

    await run(
      `CREATE TEMP TABLE stmpl AS SELECT row_number() OVER (ORDER BY id) - 1 AS rn, * FROM sittings
       WHERE household_id = :household`,
      { household: o.householdId },
    );
    const sittingTemplates = await count(run, 'stmpl');
    const sittingBase = await base('sittings');
    await run(
      `${series(o.sittings)}
       INSERT INTO sittings (${SITTING_COLUMNS.join(', ')})
       SELECT ${select(SITTING_COLUMNS, {
         started_at: `${day} || substr(t.started_at, 11)`,
         created_at: `datetime(${day}, '+18 hours')`,
         updated_at: `datetime(${day}, '+18 hours')`,
       })}
       FROM n JOIN stmpl t ON t.rn = n.i % :templates`,
      { today: o.today, days: o.days, count: o.sittings, templates: sittingTemplates },
    );
    await run(
      `INSERT INTO sitting_marks (sitting_id, key_item_id, correct, answer, created_at, updated_at)
       SELECT s.id, k.key_item_id, k.correct, k.answer, s.created_at, s.updated_at
       FROM sittings s JOIN stmpl t ON t.rn = (s.id - :base - 1) % :templates
       JOIN sitting_marks k ON k.sitting_id = t.id WHERE s.id > :base`,
      { base: sittingBase, templates: sittingTemplates },
    );
    await run('DROP TABLE tmpl');
    await run('DROP TABLE stmpl');
  });
  // As a bulk load ends: the text index left in one piece, not for a parent's write to merge.
  await mergeSearchIndex(sequelize);
  await sequelize.query('ANALYZE');
}

async function count(run: (sql: string) => Promise<unknown>, table: string): Promise<number> {
  const [rows] = (await run(`SELECT COUNT(*) AS n FROM ${table}`)) as [{ n: number }[], unknown];
  const n = rows[0]!.n;
  if (n === 0) throw new Error(`the demo household has no ${table} rows to copy`);
  return n;
}

export interface FamiliesOptions {
  /** Copies of the demo household (its owner, students, keys, sittings, misses, a plan). */
  households: number;
  misses: number;
  /** Copies whose misses also get the templates' full diagnoses (the ones the load signs in). */
  diagnosed: number;
}

/** Tables whose copies get ids worked out from each copy's number (PostgreSQL: sequences moved on). */
const NUMBERED = [
  'households',
  'users',
  'memberships',
  'students',
  'answer_keys',
  'key_items',
  'sittings',
  'misses',
  'review_plans',
  'review_plan_items',
];

/**
 * What differs between SQLite's SQL and PostgreSQL's in the fill: the list of a table's
 * columns, a series of whole numbers, the clock, and going back a number of days.
 */
function dialectOf(sequelize: Sequelize) {
  const postgres = sequelize.getDialect() === 'postgres';
  return {
    postgres,
    columns: postgres
      ? (table: string) =>
          `SELECT column_name AS name FROM information_schema.columns
           WHERE table_schema = current_schema() AND table_name = '${table}' ORDER BY ordinal_position`
      : (table: string) => `PRAGMA table_info(${table})`,
    /** Rows 0 … n−1 in a column named `name`. */
    series: postgres
      ? (name: string, n: number) => `SELECT generate_series(0, ${n - 1}) AS ${name}`
      : (name: string, n: number) =>
          `WITH RECURSIVE s(${name}) AS (SELECT 0 UNION ALL SELECT ${name} + 1 FROM s
           WHERE ${name} < ${n - 1}) SELECT ${name} FROM s`,
    now: postgres ? 'now()' : `datetime('now')`,
    daysBefore: postgres
      ? (date: string, days: string) => `(${date} - (${days}))`
      : (date: string, days: string) => `date(${date}, '-' || (${days}) || ' days')`,
  };
}

/**
 * Many households, each a copy of the demo household made by the app's services: its owner
 * (`family-N@workback.test`, the demo password), its students, answer keys and key items,
 * sittings and marks, `misses` misses (the demo's, repeated in turn) with their rules and photo
 * rows (keys renamed, since each row names its own file), and its review plan with its items.
 * Pure SQL with ids worked out from each copy's number, so 600,000 misses take a minute, not
 * hours. SQLite's or PostgreSQL's SQL, whichever the connection speaks; one transaction.
 */
export async function fillFamilies(sequelize: Sequelize, o: FamiliesOptions): Promise<void> {
  const d = dialectOf(sequelize);
  await sequelize.transaction(async (transaction) => {
    const run = async <T = Record<string, number>>(
      sql: string,
      replacements: Record<string, unknown> = {},
    ) => ((await sequelize.query(sql, { transaction, replacements })) as [T[], unknown])[0];
    const one = async (sql: string, r: Record<string, unknown> = {}) =>
      Number(Object.values((await run(sql, r))[0] ?? {})[0]);
    /** A temporary table; PostgreSQL gets its row counts at once (autovacuum skips them). */
    const temp = async (name: string, sql: string) => {
      await run(`CREATE TEMP TABLE ${name} AS ${sql}`);
      if (d.postgres) await run(`ANALYZE ${name}`);
    };
    const columns = async (table: string) =>
      (await run<{ name: string }>(d.columns(table))).map((c) => c.name);
    /**
     * INSERT INTO table (every column) SELECT each column from `t`, or its override; a column
     * set to null is left out, for the database to number.
     */
    const copy = async (
      table: string,
      from: string,
      set: Record<string, string | null>,
      r: Record<string, unknown> = {},
    ) => {
      const cols = (await columns(table)).filter((c) => set[c] !== null);
      await run(
        `INSERT INTO ${table} (${cols.map((c) => `"${c}"`).join(', ')}) SELECT ${cols
          .map((c) => set[c] ?? `t."${c}"`)
          .join(', ')} ${from}`,
        r,
      );
    };
    const [demo] = await run<{ household: number; user: number }>(
      `SELECT m.household_id AS household, u.id AS "user" FROM users u
       JOIN memberships m ON m.user_id = u.id WHERE u.email = 'parent@workback.test'`,
    );
    const h = demo!.household;
    const base = async (table: string) => one(`SELECT COALESCE(MAX(id), 0) FROM ${table}`);
    const b = {
      household: await base('households'),
      user: await base('users'),
      membership: await base('memberships'),
      student: await base('students'),
      key: await base('answer_keys'),
      item: await base('key_items'),
      sitting: await base('sittings'),
      miss: await base('misses'),
      plan: await base('review_plans'),
      planItem: await base('review_plan_items'),
    };
    const n = o.households;
    const per = o.misses;
    // PostgreSQL checks every copied row's references with a trigger per row; the copies refer
    // only to rows made here, so a superuser's fill skips those checks for this transaction.
    if (d.postgres) {
      const [role] = await run<{ su: boolean }>(
        'SELECT rolsuper AS su FROM pg_roles WHERE rolname = current_user',
      );
      if (role?.su) await run('SET LOCAL session_replication_role = replica');
    }
    await temp('k', d.series('k', n));
    // Each demo row's rank, and from it the id of its copy in household k.
    const rank = async (name: string, sql: string) => {
      await temp(name, `SELECT row_number() OVER (ORDER BY id) - 1 AS rn, id FROM (${sql}) AS src`);
      return one(`SELECT COUNT(*) FROM ${name}`);
    };
    const S = await rank('d_students', `SELECT id FROM students WHERE household_id = ${h}`);
    const K = await rank('d_keys', `SELECT id FROM answer_keys WHERE household_id = ${h}`);
    const I = await rank(
      'd_items',
      `SELECT id FROM key_items WHERE answer_key_id IN (SELECT id FROM d_keys)`,
    );
    const T = await rank('d_sittings', `SELECT id FROM sittings WHERE household_id = ${h}`);
    const M = await rank('d_misses', `SELECT id FROM misses WHERE household_id = ${h}`);
    const P = await rank('d_plans', `SELECT id FROM review_plans WHERE household_id = ${h}`);
    const PI = await rank(
      'd_plan_items',
      `SELECT id FROM review_plan_items WHERE plan_id IN (SELECT id FROM d_plans)`,
    );
    const map = (name: string, ranks: string, b0: number, size: number) =>
      temp(
        name,
        `SELECT k.k, d.id AS old, ${b0} + k.k * ${size} + d.rn + 1 AS new FROM k, ${ranks} d`,
      );
    await map('m_students', 'd_students', b.student, S);
    await map('m_keys', 'd_keys', b.key, K);
    await map('m_items', 'd_items', b.item, I);
    await map('m_sittings', 'd_sittings', b.sitting, T);
    await map('m_plans', 'd_plans', b.plan, P);
    await map('m_plan_items', 'd_plan_items', b.planItem, PI);
    await run(`CREATE TEMP TABLE m_misses AS WITH j AS (${d.series('j', per)})
      SELECT k.k, j.j, d.id AS old, ${b.miss} + k.k * ${per} + j.j + 1 AS new
      FROM k, j JOIN d_misses d ON d.rn = j.j % ${M}`);
    await run('CREATE INDEX m_misses_old ON m_misses (old)');
    if (d.postgres) await run('ANALYZE m_misses');
    const hh = `${b.household} + k.k + 1`;
    const uu = `${b.user} + k.k + 1`;

    await run(`INSERT INTO households (id, name, created_at, updated_at)
      SELECT ${hh}, 'Family ' || (k.k + 1), ${d.now}, ${d.now} FROM k`);
    await copy('users', `FROM k, users t WHERE t.id = ${demo!.user}`, {
      id: uu,
      email: `'family-' || (k.k + 1) || '@workback.test'`,
      display_name: `'Parent ' || (k.k + 1)`,
    });
    await run(`INSERT INTO memberships (id, household_id, user_id, role, created_at, updated_at)
      SELECT ${b.membership} + k.k + 1, ${hh}, ${uu}, 'owner', ${d.now}, ${d.now}
      FROM k`);
    await copy('students', 'FROM m_students m JOIN students t ON t.id = m.old', {
      id: 'm.new',
      household_id: `${b.household} + m.k + 1`,
    });
    await copy('answer_keys', 'FROM m_keys m JOIN answer_keys t ON t.id = m.old', {
      id: 'm.new',
      household_id: `${b.household} + m.k + 1`,
      course_id: 'NULL',
    });
    await copy(
      'key_items',
      'FROM m_items m JOIN key_items t ON t.id = m.old JOIN m_keys a ON a.old = t.answer_key_id AND a.k = m.k',
      { id: 'm.new', answer_key_id: 'a.new' },
    );
    await copy(
      'sittings',
      `FROM m_sittings m JOIN sittings t ON t.id = m.old
       JOIN m_students s ON s.old = t.student_id AND s.k = m.k
       JOIN m_keys a ON a.old = t.answer_key_id AND a.k = m.k`,
      {
        id: 'm.new',
        household_id: `${b.household} + m.k + 1`,
        student_id: 's.new',
        answer_key_id: 'a.new',
      },
    );
    await copy(
      'sitting_marks',
      `FROM m_sittings m JOIN sitting_marks t ON t.sitting_id = m.old
       JOIN m_items i ON i.old = t.key_item_id AND i.k = m.k`,
      { id: null, sitting_id: 'm.new', key_item_id: 'i.new' },
    );
    // PostgreSQL: the two trigram indexes are built once over all the rows, not row by row.
    const search = d.postgres
      ? await run<{ name: string; def: string }>(
          `SELECT indexname AS name, indexdef AS def FROM pg_indexes
           WHERE schemaname = current_schema() AND tablename = 'misses' AND indexdef LIKE '%gin_trgm_ops%'`,
        )
      : [];
    for (const index of search) await run(`DROP INDEX "${index.name}"`);
    await copy(
      'misses',
      `FROM m_misses m JOIN misses t ON t.id = m.old
       JOIN m_students s ON s.old = t.student_id AND s.k = m.k
       LEFT JOIN m_sittings st ON st.old = t.sitting_id AND st.k = m.k
       LEFT JOIN m_items i ON i.old = t.key_item_id AND i.k = m.k`,
      {
        id: 'm.new',
        household_id: `${b.household} + m.k + 1`,
        student_id: 's.new',
        // The demo's misses again, a week further back each time round.
        occurred_on: d.daysBefore('t.occurred_on', `7 * (m.j / ${M})`),
        sitting_id: 'st.new',
        key_item_id: 'i.new',
        idempotency_key: 'NULL',
        request_digest: 'NULL',
        created_by: `${b.user} + m.k + 1`,
        updated_by: `${b.user} + m.k + 1`,
      },
    );
    for (const index of search) await run(index.def);
    await run(`INSERT INTO miss_rules (miss_id, rule_id, household_id)
      SELECT m.new, t.rule_id, ${b.household} + m.k + 1 FROM m_misses m
      JOIN miss_rules t ON t.miss_id = m.old`);
    await run(`INSERT INTO miss_diagnoses (miss_id, diagnosis)
      SELECT m.new, t.diagnosis FROM m_misses m JOIN miss_diagnoses t ON t.miss_id = m.old
      WHERE m.k < ${o.diagnosed}`);
    await copy('photos', 'FROM m_misses m JOIN photos t ON t.miss_id = m.old', {
      id: null,
      miss_id: 'm.new',
      storage_key: `t.storage_key || '.' || m.new`,
      thumb_key: `t.thumb_key || '.' || m.new`,
    });
    await copy(
      'review_plans',
      `FROM m_plans m JOIN review_plans t ON t.id = m.old
       JOIN m_students s ON s.old = t.student_id AND s.k = m.k`,
      { id: 'm.new', household_id: `${b.household} + m.k + 1`, student_id: 's.new' },
    );
    await copy(
      'review_plan_items',
      `FROM m_plan_items m JOIN review_plan_items t ON t.id = m.old
       JOIN m_plans p ON p.old = t.plan_id AND p.k = m.k`,
      { id: 'm.new', plan_id: 'p.new', done_by: 'NULL' },
    );
    await run(`INSERT INTO review_plan_item_misses (item_id, miss_id)
      SELECT i.new, mm.new FROM review_plan_item_misses t
      JOIN m_plan_items i ON i.old = t.item_id
      JOIN m_misses mm ON mm.old = t.miss_id AND mm.k = i.k AND mm.j < ${M}`);
    // PostgreSQL numbers new rows from a sequence, which the ids given here did not move.
    if (d.postgres) {
      for (const table of NUMBERED) {
        await run(
          `SELECT setval(pg_get_serial_sequence('${table}', 'id'), (SELECT MAX(id) FROM ${table}))`,
        );
      }
    }
    for (const t of [
      'k',
      'd_students',
      'd_keys',
      'd_items',
      'd_sittings',
      'd_misses',
      'd_plans',
      'd_plan_items',
      'm_students',
      'm_keys',
      'm_items',
      'm_sittings',
      'm_plans',
      'm_plan_items',
      'm_misses',
    ]) {
      await run(`DROP TABLE ${t}`);
    }
  });
  // As a bulk load ends: the text index left in one piece, not for a parent's write to merge.
  await mergeSearchIndex(sequelize);
  await sequelize.query('ANALYZE');
}
