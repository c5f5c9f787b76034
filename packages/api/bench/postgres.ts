import { randomBytes } from 'node:crypto';
import pg from 'pg';

/** Where the bench looks for a PostgreSQL server, first set wins. */
export const POSTGRES_SOURCES = ['BENCH_DATABASE_URL', 'TEST_DATABASE_URL', 'DATABASE_URL'];

export type ThrowawayDatabase = { url: string; drop: () => Promise<void> } | { skipped: string };

/**
 * A database of its own on the PostgreSQL server the environment names, created empty and
 * dropped afterwards, so a bench never writes into the database DATABASE_URL names. Without a
 * server, or when it cannot be reached, says why instead (the bench skips PostgreSQL).
 */
export async function throwawayDatabase(prefix: string): Promise<ThrowawayDatabase> {
  const source = POSTGRES_SOURCES.find((name) => process.env[name]);
  if (!source) {
    return {
      skipped:
        `no PostgreSQL server: set ${POSTGRES_SOURCES.join(', ')} or start a throwaway one with ` +
        `eval "$(scripts/pg-cluster.sh start)"`,
    };
  }
  const server = process.env[source]!;
  const name = `${prefix}_${process.pid}_${randomBytes(3).toString('hex')}`;
  const admin = async (sql: string) => {
    const client = new pg.Client({ connectionString: server, connectionTimeoutMillis: 5_000 });
    await client.connect();
    try {
      await client.query(sql);
    } finally {
      await client.end();
    }
  };
  try {
    await admin(`CREATE DATABASE "${name}"`);
  } catch (e) {
    const where = new URL(server);
    return {
      skipped: `PostgreSQL at ${where.host} (${source}) did not make a database: ${(e as Error).message}`,
    };
  }
  const url = new URL(server);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    drop: () => admin(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`),
  };
}
