import type { QueryInterface } from 'sequelize';

export const name = '0006-miss-search';

/**
 * A full-text index over each miss's problem and the child's explanation, for the notebook's
 * `q` search. The trigram tokenizer matches any run of three or more characters, as the
 * `LIKE '%…%'` scan it replaces did, but through an index (SQLite's FTS5). It stores no text
 * of its own (`content='misses'`); the triggers keep it in step with every write.
 */
const STATEMENTS = [
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

/**
 * PostgreSQL: pg_trgm's GIN indexes on the two columns serve `ILIKE '%…%'` from three characters
 * on, the same matches as FTS5's trigram tokenizer, kept in step by PostgreSQL itself.
 */
const POSTGRES_STATEMENTS = [
  'CREATE EXTENSION IF NOT EXISTS pg_trgm',
  'CREATE INDEX misses_search_problem ON misses USING gin (problem gin_trgm_ops)',
  'CREATE INDEX misses_search_explanation ON misses USING gin (explanation gin_trgm_ops)',
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  const postgres = qi.sequelize.getDialect() === 'postgres';
  for (const sql of postgres ? POSTGRES_STATEMENTS : STATEMENTS) await qi.sequelize.query(sql);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  if (qi.sequelize.getDialect() === 'postgres') {
    await qi.sequelize.query('DROP INDEX IF EXISTS misses_search_problem');
    await qi.sequelize.query('DROP INDEX IF EXISTS misses_search_explanation');
    return;
  }
  for (const trigger of ['insert', 'delete', 'update']) {
    await qi.sequelize.query(`DROP TRIGGER IF EXISTS misses_search_${trigger}`);
  }
  await qi.sequelize.query('DROP TABLE IF EXISTS misses_search');
}
