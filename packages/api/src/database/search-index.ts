import type { Sequelize } from 'sequelize';

/**
 * Merges the notebook's text index on SQLite (FTS5's `misses_search`) into one segment.
 *
 * FTS5 keeps each write's entries as a new segment and merges segments as they gather: a little
 * after each write (`automerge`), or every segment of a level at once when 16 have gathered
 * (`crisismerge`) (SQLite's FTS5 documentation: the 'optimize' command and the 'automerge' and
 * 'crisismerge' options). An index built in one statement (migration 0014's rebuild, a bulk fill)
 * is left in many segments, and the write that tips a level over merges them on the spot. On
 * 600,000 misses in 17 segments one insert took 569 ms with the machine otherwise idle, and
 * under load such a write held the write lock that every family's writes queue for. Merged once
 * (0.9 s), the next 18,000 inserts one at a time took at most 50 ms each. On PostgreSQL there is
 * nothing to merge (pg_trgm's indexes).
 */
export async function mergeSearchIndex(sequelize: Sequelize): Promise<void> {
  if (sequelize.getDialect() !== 'sqlite') return;
  await sequelize.query("INSERT INTO misses_search(misses_search) VALUES('optimize')");
}
