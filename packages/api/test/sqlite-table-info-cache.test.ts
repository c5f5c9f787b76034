import sqlite3 from 'sqlite3';
import { afterEach, describe, expect, it } from 'vitest';
import { TableInfoCache } from '../src/database/sqlite-table-info-cache.js';

type Column = { name: string; type: string };

function all(db: sqlite3.Database, sql: string): Promise<Column[]> {
  return new Promise((resolve, reject) =>
    db.all(sql, (err: Error | null, rows: Column[]) => (err ? reject(err) : resolve(rows))),
  );
}

function exec(db: sqlite3.Database, sql: string): Promise<void> {
  return new Promise((resolve, reject) => db.exec(sql, (err) => (err ? reject(err) : resolve())));
}

// Sequelize's SQLite dialect writes exactly this before each SELECT (lib/dialects/sqlite/query.js).
const ASK = 'PRAGMA table_info(`misses`)';

describe('the column-type answers kept for Sequelize', () => {
  let db: sqlite3.Database;
  afterEach(() => new Promise<void>((resolve) => db.close(() => resolve())));

  async function wrapped() {
    db = new sqlite3.Database(':memory:');
    await exec(db, 'CREATE TABLE misses (id INTEGER PRIMARY KEY, occurred_on DATE)');
    const cache = new TableInfoCache();
    cache.wrap(db as never);
    return cache;
  }

  it('asks the database while migrations may still change the schema', async () => {
    await wrapped();
    expect((await all(db, ASK)).map((c) => c.name)).toEqual(['id', 'occurred_on']);
    await exec(db, 'ALTER TABLE misses ADD COLUMN stage TEXT');
    expect((await all(db, ASK)).map((c) => c.name)).toEqual(['id', 'occurred_on', 'stage']);
  });

  it('answers from memory once the schema is trusted, with the types the database gave', async () => {
    const cache = await wrapped();
    await exec(db, 'ALTER TABLE misses ADD COLUMN stage TEXT');
    cache.trust();
    const first = await all(db, ASK);
    expect(first.map((c) => [c.name, c.type])).toEqual([
      ['id', 'INTEGER'],
      ['occurred_on', 'DATE'],
      ['stage', 'TEXT'],
    ]);
    // A column added behind the app's back is not seen: the proof the answer came from memory.
    await exec(db, 'ALTER TABLE misses ADD COLUMN later TEXT');
    expect(await all(db, ASK)).toBe(first);
  });

  it('leaves every other statement to the database', async () => {
    const cache = await wrapped();
    cache.trust();
    await exec(db, "INSERT INTO misses (id, occurred_on) VALUES (1, '2026-11-30')");
    const rows = await all(db, 'SELECT id, occurred_on AS type FROM misses');
    expect(rows).toEqual([{ id: 1, type: '2026-11-30' }]);
    await expect(all(db, 'PRAGMA table_info(`nope`) AND nonsense')).rejects.toThrow(/syntax/);
  });
});
