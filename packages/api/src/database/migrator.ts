import type { Sequelize } from 'sequelize-typescript';
import { SequelizeStorage, Umzug } from 'umzug';
import { MIGRATIONS } from './migrations/index.js';

export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: MIGRATIONS.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Any number, the same in every process: the key of PostgreSQL's advisory lock for migrating. */
const MIGRATION_LOCK = 7_531_150;

/**
 * Brings the schema up to date. On PostgreSQL several processes may start at once: the first
 * takes an advisory lock (held by a transaction of its own) and migrates, the others wait for it
 * and then find nothing left to do. SQLite is one process's file.
 */
export async function migrateOnce(sequelize: Sequelize): Promise<void> {
  if (sequelize.getDialect() !== 'postgres') {
    await createMigrator(sequelize).up();
    return;
  }
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(`SELECT pg_advisory_xact_lock(${MIGRATION_LOCK})`, { transaction });
    await createMigrator(sequelize).up();
  });
}
