import type { QueryInterface } from 'sequelize';

export const name = '0014-miss-search-by-household';

/**
 * The notebook's text search, found within the household (SQLite). Migration 0006 keyed the
 * FTS5 trigram index by the miss's id, so a search found every household's matches (48,000 for
 * "zero" among 2,000 households) and then kept the household's few. Here each entry's rowid is
 * `(household_id << 32) + id`: a household's entries are one rowid range, and FTS5 seeks
 * straight to it (`rowid BETWEEN …` beside `MATCH`), reading only that household's matches.
 * The table is contentless (`content=''`: the rowid no longer names a misses row) and takes
 * plain DELETEs (`contentless_delete=1`, SQLite 3.43 on); the triggers keep it in step.
 * PostgreSQL is unchanged: its pg_trgm condition already sits beside household_id in one WHERE.
 */
const KEY = (row: 'new' | 'old') => `(${row}.household_id << 32) + ${row}.id`;

const STATEMENTS = [
  'DROP TRIGGER IF EXISTS misses_search_insert',
  'DROP TRIGGER IF EXISTS misses_search_delete',
  'DROP TRIGGER IF EXISTS misses_search_update',
  'DROP TABLE IF EXISTS misses_search',
  `CREATE VIRTUAL TABLE misses_search USING fts5(
     problem, explanation, content='', contentless_delete=1, tokenize='trigram')`,
  `INSERT INTO misses_search(rowid, problem, explanation)
     SELECT (household_id << 32) + id, problem, explanation FROM misses`,
  `CREATE TRIGGER misses_search_insert AFTER INSERT ON misses BEGIN
     INSERT INTO misses_search(rowid, problem, explanation)
       VALUES (${KEY('new')}, new.problem, new.explanation);
   END`,
  `CREATE TRIGGER misses_search_delete AFTER DELETE ON misses BEGIN
     DELETE FROM misses_search WHERE rowid = ${KEY('old')};
   END`,
  `CREATE TRIGGER misses_search_update AFTER UPDATE OF problem, explanation, household_id
   ON misses BEGIN
     DELETE FROM misses_search WHERE rowid = ${KEY('old')};
     INSERT INTO misses_search(rowid, problem, explanation)
       VALUES (${KEY('new')}, new.problem, new.explanation);
   END`,
];

/** Migration 0006's table, keyed by the miss's id, for `down`. */
const BY_ID = [
  'DROP TRIGGER IF EXISTS misses_search_insert',
  'DROP TRIGGER IF EXISTS misses_search_delete',
  'DROP TRIGGER IF EXISTS misses_search_update',
  'DROP TABLE IF EXISTS misses_search',
  `CREATE VIRTUAL TABLE misses_search USING fts5(
     problem, explanation, content='misses', content_rowid='id', tokenize='trigram')`,
  `INSERT INTO misses_search(misses_search) VALUES ('rebuild')`,
  `CREATE TRIGGER misses_search_insert AFTER INSERT ON misses BEGIN
     INSERT INTO misses_search(rowid, problem, explanation)
       VALUES (new.id, new.problem, new.explanation);
   END`,
  `CREATE TRIGGER misses_search_delete AFTER DELETE ON misses BEGIN
     INSERT INTO misses_search(misses_search, rowid, problem, explanation)
       VALUES ('delete', old.id, old.problem, old.explanation);
   END`,
  `CREATE TRIGGER misses_search_update AFTER UPDATE OF problem, explanation ON misses BEGIN
     INSERT INTO misses_search(misses_search, rowid, problem, explanation)
       VALUES ('delete', old.id, old.problem, old.explanation);
     INSERT INTO misses_search(rowid, problem, explanation)
       VALUES (new.id, new.problem, new.explanation);
   END`,
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  if (qi.sequelize.getDialect() === 'postgres') return;
  for (const sql of STATEMENTS) await qi.sequelize.query(sql);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  if (qi.sequelize.getDialect() === 'postgres') return;
  for (const sql of BY_ID) await qi.sequelize.query(sql);
}
