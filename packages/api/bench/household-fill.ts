import type { Sequelize } from 'sequelize-typescript';

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
  await sequelize.query('ANALYZE');
}

async function count(run: (sql: string) => Promise<unknown>, table: string): Promise<number> {
  const [rows] = (await run(`SELECT COUNT(*) AS n FROM ${table}`)) as [{ n: number }[], unknown];
  const n = rows[0]!.n;
  if (n === 0) throw new Error(`the demo household has no ${table} rows to copy`);
  return n;
}
