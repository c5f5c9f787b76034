import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { keepStatements, MAX_KEPT_STATEMENTS } from '../src/database/sqlite-statements.js';

// Statements kept compiled on a real SQLite file (database/sqlite-statements.ts): each call must
// answer as a fresh statement would, and the connection must still close.
let dir: string;
let db: sqlite3.Database;
let compiled: string[];

const open = (file: string) =>
  new Promise<sqlite3.Database>((resolve, reject) => {
    const c = new sqlite3.Database(file, (err) => (err ? reject(err) : resolve(c)));
  });
const all = <T>(c: sqlite3.Database, sql: string, params: unknown[] = []) =>
  new Promise<T[]>((resolve, reject) =>
    c.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))),
  );
const run = (c: sqlite3.Database, sql: string, params: unknown[] = []) =>
  new Promise<{ lastID: number; changes: number }>((resolve, reject) =>
    c.run(sql, params, function (err) {
      if (err) reject(err);
      else resolve({ lastID: this.lastID, changes: this.changes });
    }),
  );
const close = (c: sqlite3.Database) =>
  new Promise<void>((resolve, reject) => c.close((err) => (err ? reject(err) : resolve())));

beforeEach(async () => {
  dir = mkdtempSync(path.join(tmpdir(), 'workback-statements-'));
  db = await open(path.join(dir, 'kept.sqlite'));
  await run(db, 'PRAGMA journal_mode = WAL');
  await run(db, 'CREATE TABLE items (id INTEGER PRIMARY KEY, name TEXT UNIQUE NOT NULL)');
  compiled = [];
  const prepare = db.prepare.bind(db) as (sql: string, cb: (err: Error | null) => void) => never;
  db.prepare = ((sql: string, cb: (err: Error | null) => void) => {
    compiled.push(sql);
    return prepare(sql, cb);
  }) as typeof db.prepare;
  keepStatements(db);
});

afterEach(() => rmSync(dir, { recursive: true, force: true }));

describe('statements kept compiled on a connection', () => {
  it('compiles SQL with bound values once, and answers each call with its own values', async () => {
    const insert = 'INSERT INTO items (name) VALUES (?)';
    const first = await run(db, insert, ['first']);
    const second = await run(db, insert, ['second']);
    // `this` of the callback carries the new row's id, as Sequelize reads it.
    expect([first, second]).toEqual([
      { lastID: 1, changes: 1 },
      { lastID: 2, changes: 1 },
    ]);
    const byId = 'SELECT name FROM items WHERE id = ?';
    expect(await all(db, byId, [2])).toEqual([{ name: 'second' }]);
    expect(await all(db, byId, [1])).toEqual([{ name: 'first' }]);
    expect(await all(db, byId, [3])).toEqual([]);
    expect(compiled).toEqual([insert, byId]);
    await close(db);
  });

  it('keeps transaction control, and compiles SQL with values written into it each time', async () => {
    for (const name of ['a', 'b']) {
      await all(db, 'BEGIN IMMEDIATE TRANSACTION;');
      await run(db, `INSERT INTO items (name) VALUES ('${name}')`);
      await all(db, 'COMMIT;');
    }
    expect(await all(db, 'SELECT COUNT(*) AS n FROM items')).toEqual([{ n: 2 }]);
    expect(compiled).toEqual(['BEGIN IMMEDIATE TRANSACTION;', 'COMMIT;']);
    await close(db);
  });

  it('gives SQLite’s message for SQL that does not compile, each time, keeping nothing broken', async () => {
    const bad = 'SELECT nope FROM items WHERE id = ?';
    await expect(all(db, bad, [1])).rejects.toThrow(/no such column: nope/);
    await expect(all(db, bad, [1])).rejects.toThrow(/no such column: nope/);
    expect(compiled).toEqual([bad, bad]);
    await close(db);
  });

  it('lets a statement that failed go, and the same SQL then works', async () => {
    const insert = 'INSERT INTO items (name) VALUES (?)';
    await run(db, insert, ['same']);
    await expect(run(db, insert, ['same'])).rejects.toThrow(/UNIQUE constraint failed/);
    expect(await run(db, insert, ['other'])).toEqual({ lastID: 2, changes: 1 });
    expect(compiled).toEqual([insert, insert]);
    await close(db);
  });

  it('holds no snapshot after a read: another connection’s commit shows, and the log empties', async () => {
    const other = await open(path.join(dir, 'kept.sqlite'));
    const names = 'SELECT name FROM items WHERE id > ? ORDER BY id';
    expect(await all(db, names, [0])).toEqual([]);
    await run(other, 'INSERT INTO items (name) VALUES (?)', ['from the other connection']);
    expect(await all(db, names, [0])).toEqual([{ name: 'from the other connection' }]);
    expect(await all(other, 'PRAGMA wal_checkpoint(TRUNCATE)')).toEqual([
      { busy: 0, log: 0, checkpointed: 0 },
    ]);
    await close(other);
    await close(db);
  });

  it('holds ROLLBACK until the statements sent before it are answered, so none commits alone', async () => {
    // node-sqlite3's default parallel mode, as the write connection runs: each statement
    // takes its own worker thread. A long read, then an insert, then ROLLBACK, all sent at once.
    // The read and ROLLBACK are compiled already and the insert is not, so unheld, ROLLBACK
    // would reach SQLite while the insert still compiles, and the insert would then commit.
    const count =
      'WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < ?) SELECT i FROM n';
    await all(db, 'BEGIN IMMEDIATE TRANSACTION;');
    await all(db, count, [1]);
    await all(db, 'ROLLBACK;');
    await all(db, 'BEGIN IMMEDIATE TRANSACTION;');
    const answered: string[] = [];
    const sent = (label: string, p: Promise<unknown>) =>
      p.then(
        () => answered.push(label),
        (err: Error) => answered.push(`${label}: ${err.message}`),
      );
    await Promise.all([
      sent('read', all(db, count, [200_000])),
      sent('insert', run(db, 'INSERT INTO items (name) VALUES (?)', ['rolled back'])),
      sent('rollback', all(db, 'ROLLBACK;')),
    ]);
    expect(answered.at(-1)).toBe('rollback');
    expect(answered.slice(0, 2).sort()).toEqual(['insert', 'read']);
    expect(await all(db, 'SELECT name FROM items')).toEqual([]);
    await close(db);
  });

  it(`keeps at most ${MAX_KEPT_STATEMENTS}, letting the least recently used go`, async () => {
    const sqlFor = (n: number) => `SELECT ${n} AS n FROM items WHERE id > ?`;
    await all(db, sqlFor(0), [0]);
    for (let n = 1; n < MAX_KEPT_STATEMENTS; n++) await all(db, sqlFor(n), [0]);
    // Used again, so the least recently used is now 1.
    await all(db, sqlFor(0), [0]);
    await all(db, sqlFor(MAX_KEPT_STATEMENTS), [0]);
    compiled = [];
    await all(db, sqlFor(0), [0]);
    await all(db, sqlFor(1), [0]);
    expect(compiled).toEqual([sqlFor(1)]);
    // Every kept statement is finalized first: the connection closes cleanly.
    await close(db);
  });
});
