import { getConnectionToken } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  driverBoolean,
  driverDate,
  placeholders,
  selectList,
  SqlReader,
} from '../src/database/sql-reader.js';
import { Miss } from '../src/misses/models/miss.model.js';
import { startTestApp, type TestApp } from './support/test-app.js';

// SqlReader reads past the models (database/sql-reader.ts); its rows, converted as the services
// convert them, must be what the models read from the same demo rows, on either database.
let t: TestApp;
let reader: SqlReader;
let sequelize: Sequelize;

beforeAll(async () => {
  t = await startTestApp();
  reader = t.app.get(SqlReader);
  sequelize = t.app.get<Sequelize>(getConnectionToken());
}, 120_000);
afterAll(() => t.close());

describe('reads straight through the driver', () => {
  it('gives the rows the model reads, by the attributes’ own names', async () => {
    const models = await Miss.findAll({ order: [['id', 'ASC']], limit: 5 });
    expect(models.length).toBeGreaterThan(2);
    const ids = models.map((m) => m.id);
    const columns = selectList(Miss, ['id', 'studentId', 'occurredOn', 'correct', 'createdAt']);
    const rows = await reader.rows<Record<string, unknown>>(
      `SELECT ${columns()} FROM "misses" WHERE "id" IN (${placeholders(ids.length)}) ORDER BY "id"`,
      ids,
    );
    expect(
      rows.map((r) => ({
        id: r.id,
        studentId: r.studentId,
        occurredOn: r.occurredOn,
        correct: driverBoolean(r.correct),
        createdAt: driverDate(r.createdAt).toISOString(),
      })),
    ).toEqual(
      models.map((m) => ({
        id: m.id,
        studentId: m.studentId,
        occurredOn: m.occurredOn,
        correct: m.correct,
        createdAt: m.createdAt.toISOString(),
      })),
    );
  });

  it('binds every kind of parameter, a boolean as each database keeps it', async () => {
    const [row] = await reader.rows<{ n: number | string }>(
      'SELECT COUNT(*) AS "n" FROM "misses" WHERE "id" > ? AND "problem" <> ? AND ("correct" = ? OR "correct" IS NULL OR "correct" = ?)',
      [0, 'no such problem', true, false],
    );
    expect(Number(row!.n)).toBe(await Miss.count());
  });

  it('refuses bad SQL with the database’s error, each time, and keeps serving reads', async () => {
    await expect(reader.rows('SELECT "nope" FROM "misses"')).rejects.toThrow(/nope/);
    // SQLite keeps statements compiled: one that did not compile is not kept broken.
    await expect(reader.rows('SELECT "nope" FROM "misses"')).rejects.toThrow(/nope/);
    const [row] = await reader.rows<{ n: number | string }>('SELECT COUNT(*) AS "n" FROM "users"');
    expect(Number(row!.n)).toBeGreaterThan(0);
    // The connections Sequelize lends are given back: its own queries still run.
    expect(await sequelize.query('SELECT 1 AS one', { plain: true })).toEqual({ one: 1 });
  });

  it('sees every write committed since it last ran the same SQL, on each connection', async () => {
    const sql = 'SELECT "display_name" AS "name" FROM "users" WHERE "id" = ?';
    const [user] = await sequelize
      .query('SELECT MIN(id) AS id FROM users', { plain: true })
      .then((r) => [r as { id: number }]);
    const names = async () =>
      // Enough reads that every read connection runs the statement.
      Promise.all(Array.from({ length: 8 }, () => reader.rows<{ name: string }>(sql, [user!.id])));
    const before = (await names())[0]![0]!.name;
    try {
      await sequelize.query('UPDATE users SET display_name = ? WHERE id = ?', {
        replacements: ['Renamed for the read test', user!.id],
      });
      expect(new Set((await names()).map((rows) => rows[0]!.name))).toEqual(
        new Set(['Renamed for the read test']),
      );
    } finally {
      await sequelize.query('UPDATE users SET display_name = ? WHERE id = ?', {
        replacements: [before, user!.id],
      });
    }
    expect((await names())[0]![0]!.name).toBe(before);
    if (sequelize.getDialect() === 'sqlite') {
      // A kept statement read to its end holds no snapshot: the whole log can be checkpointed.
      const checkpoint = await sequelize.query('PRAGMA wal_checkpoint(TRUNCATE)', { plain: true });
      expect(checkpoint).toMatchObject({ busy: 0 });
    }
  });
});
