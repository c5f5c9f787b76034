import { getConnectionToken } from '@nestjs/sequelize';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { InsertsService, type NewRows } from '../src/database/inserts.service.js';
import { MissRule } from '../src/misses/models/miss-rule.model.js';
import { Miss } from '../src/misses/models/miss.model.js';
import { onPostgres, startTestApp, type TestApp } from './support/test-app.js';

// A new row and its dependents written together (database/inserts.service.ts): on SQLite as one
// exec with BEGIN and COMMIT of its own, on PostgreSQL through the models in a transaction.
// Either way the rows must be stored exactly as Sequelize's own create stores them.
let t: TestApp;
let sequelize: Sequelize;
let inserts: InsertsService;
let household: { householdId: number; studentId: number };

beforeAll(async () => {
  t = await startTestApp();
  sequelize = t.app.get<Sequelize>(getConnectionToken());
  inserts = t.app.get(InsertsService);
  const [first] = await sequelize.query<{ householdId: number; studentId: number }>(
    'SELECT household_id AS "householdId", id AS "studentId" FROM students ORDER BY id LIMIT 1',
    { type: QueryTypes.SELECT },
  );
  household = first!;
}, 120_000);
afterAll(() => t.close());

/** A miss's values with JSON, date-only, boolean and null columns among them. */
function missValues(problem: string, extra: Record<string, unknown> = {}) {
  return {
    ...household,
    occurredOn: '2026-11-30',
    problem,
    answer: '139',
    steps: { kind: 'subtraction', lines: ['214', '- 75', '139'] },
    explanation: 'I took the small from the big',
    cause: 'step',
    note: '',
    status: 'logged',
    skills: ['regrouping'],
    revisit: ['12'],
    correct: false,
    expected: '139',
    ruleIds: ['sub-smaller-from-larger'],
    facts: [],
    kind: 'computation',
    createdBy: null,
    updatedBy: null,
    ...extra,
  };
}

const rule = (missId: number, ruleId: string): NewRows => ({
  model: MissRule,
  values: [{ missId, ruleId, householdId: household.householdId }],
});

async function rowsOf(table: string, where: string): Promise<Record<string, unknown>[]> {
  return sequelize.query(`SELECT * FROM ${table} WHERE ${where} ORDER BY 1`, {
    type: QueryTypes.SELECT,
  });
}

async function count(table: string): Promise<number> {
  const [row] = await sequelize.query<{ n: number | string }>(
    `SELECT COUNT(*) AS n FROM ${table}`,
    { type: QueryTypes.SELECT },
  );
  return Number(row!.n);
}

describe('a new row with its dependents, written together', () => {
  it('stores a miss exactly as Sequelize’s create does, with its rule rows', async () => {
    const made = await Miss.create(missValues('214 - 75 (create)'));
    const id = await inserts.withNewId(Miss, (id) => [
      { model: Miss, values: [{ ...missValues('214 - 75 (together)'), id }] },
      rule(id, 'sub-smaller-from-larger'),
    ]);
    const [byCreate, together] = await rowsOf('misses', `id IN (${made.id}, ${id})`);
    const { id: _a, problem: _p, created_at: createdA, updated_at: _u, ...rest } = byCreate!;
    const {
      id: _b,
      problem: _q,
      created_at: createdB,
      updated_at: _v,
      ...restTogether
    } = together!;
    // The reference is Sequelize's own create: every stored value, JSON and dates included.
    expect(restTogether).toEqual(rest);
    expect(typeof createdB).toBe(typeof createdA);
    if (typeof createdA === 'string') {
      expect(createdB).toMatch(/^\d{4}-\d\d-\d\d \d\d:\d\d:\d\d\.\d{3} \+00:00$/);
    }
    expect(id).toBeGreaterThan(made.id);
    expect(await rowsOf('miss_rules', `miss_id = ${id}`)).toEqual([
      { miss_id: id, rule_id: 'sub-smaller-from-larger', household_id: household.householdId },
    ]);
    // Read back through the model, as the app reads it.
    const read = await Miss.findByPk(id);
    expect(read!.steps).toEqual({ kind: 'subtraction', lines: ['214', '- 75', '139'] });
    expect(read!.skills).toEqual(['regrouping']);
  });

  it('writes nothing when its last row is refused, and fails as Sequelize’s own error', async () => {
    const before = { misses: await count('misses'), rules: await count('miss_rules') };
    // The same rule twice breaks miss_rules' primary key after the miss itself was inserted.
    const twice = inserts.withNewId(Miss, (id) => [
      { model: Miss, values: [{ ...missValues('300 - 1 (refused)'), id }] },
      {
        model: MissRule,
        values: [
          { missId: id, ruleId: 'same-rule', householdId: household.householdId },
          { missId: id, ruleId: 'same-rule', householdId: household.householdId },
        ],
      },
    ]);
    await expect(twice).rejects.toBeInstanceOf(UniqueConstraintError);
    expect({ misses: await count('misses'), rules: await count('miss_rules') }).toEqual(before);
    // The write queue and the connection go on.
    const id = await inserts.withNewId(Miss, (id) => [
      { model: Miss, values: [{ ...missValues('300 - 1 (after)'), id }] },
    ]);
    expect(await rowsOf('misses', `id = ${id}`)).toHaveLength(1);
  });

  it('refuses a second miss with the same idempotency key in the household', async () => {
    const key = { idempotencyKey: 'same-key-twice', requestDigest: 'digest' };
    await inserts.withNewId(Miss, (id) => [
      { model: Miss, values: [{ ...missValues('5 + 5 (first)', key), id }] },
    ]);
    const again = inserts.withNewId(Miss, (id) => [
      { model: Miss, values: [{ ...missValues('5 + 5 (again)', key), id }] },
    ]);
    await expect(again).rejects.toBeInstanceOf(UniqueConstraintError);
  });

  it('takes the next free id after rows made through the model or straight in SQL', async () => {
    const first = await inserts.withNewId(Miss, (id) => [
      { model: Miss, values: [{ ...missValues('1 + 1'), id }] },
    ]);
    const byModel = await Miss.create(missValues('2 + 2'));
    expect(byModel.id).toBe(first + 1);
    const afterModel = await inserts.withNewId(Miss, (id) => [
      { model: Miss, values: [{ ...missValues('3 + 3'), id }] },
      rule(id, 'after-model'),
    ]);
    expect(afterModel).toBe(byModel.id + 1);
    if (onPostgres()) return; // PostgreSQL's sequence hands out ids; nothing here is counted.
    // A row no model hook hears of (another process, a script) takes the id counted on next:
    // the primary key refuses it, and the rows go in under the next free id instead.
    const fields = Object.values(Miss.getAttributes())
      .map((a) => a.field!)
      .filter((f) => f !== 'id');
    await sequelize.query(
      `INSERT INTO misses (id, ${fields.join(', ')})
       SELECT ${afterModel + 1}, ${fields.join(', ')} FROM misses WHERE id = ${afterModel}`,
    );
    const afterSql = await inserts.withNewId(Miss, (id) => [
      { model: Miss, values: [{ ...missValues('4 + 4'), id }] },
      rule(id, 'after-sql'),
    ]);
    expect(afterSql).toBe(afterModel + 2);
    expect(await rowsOf('miss_rules', `miss_id = ${afterSql}`)).toEqual([
      { miss_id: afterSql, rule_id: 'after-sql', household_id: household.householdId },
    ]);
  });
});
