import { randomBytes } from 'node:crypto';
import pg from 'pg';

/**
 * The api-pg project's PostgreSQL: a server URL (TEST_DATABASE_URL, set by
 * `scripts/pg-cluster.sh start`) on which each test app gets a database of its own, copied
 * from a template seeded once per run (CREATE DATABASE … TEMPLATE is a file copy).
 */
export const PG_MISSING = [
  'The api-pg project runs the API tests on PostgreSQL and needs TEST_DATABASE_URL.',
  'Start a throwaway cluster first (CI does this):',
  '  eval "$(scripts/pg-cluster.sh start)"',
  'and stop it afterwards with: scripts/pg-cluster.sh stop',
  'To run API test files on SQLite only, name the project: npx vitest run --project api <files>',
].join('\n');

export function serverUrl(): string {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error(PG_MISSING);
  return url;
}

/** The same server with another database name. */
export function databaseUrl(server: string, database: string): string {
  const url = new URL(server);
  url.pathname = `/${database}`;
  return url.toString();
}

export function newDatabaseName(prefix: string): string {
  return `${prefix}_${process.pid}_${randomBytes(4).toString('hex')}`;
}

export async function admin<T>(server: string, work: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: server });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

export async function createDatabase(server: string, name: string, template?: string) {
  await admin(server, (c) =>
    c.query(`CREATE DATABASE "${name}"${template ? ` TEMPLATE "${template}"` : ''}`),
  );
}

export async function dropDatabase(server: string, name: string) {
  await admin(server, (c) => c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`));
}
