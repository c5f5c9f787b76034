import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0010-shared-state';

/**
 * PostgreSQL only: what every process behind a load balancer must share besides the data.
 * `sessions` is connect-pg-simple's table (its own schema, made here so two processes starting
 * together never race to create it); `limit_hits` and `limit_blocks` hold the counts of the
 * sign-in, reset and invitation limits (`database/postgres-throttler-storage.ts`). On SQLite,
 * one process keeps sessions in `sessions.sqlite` and limits in memory: nothing to create.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  if (qi.sequelize.getDialect() !== 'postgres') return;
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING, primaryKey: true, allowNull: false },
    sess: { type: DataTypes.JSON, allowNull: false },
    expire: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sessions', ['expire']);
  await qi.createTable('limit_hits', {
    key: { type: DataTypes.STRING(300), allowNull: false },
    name: { type: DataTypes.STRING(60), allowNull: false },
    // Milliseconds since 1970 by the database's clock, so every process counts alike.
    expires_at: { type: DataTypes.BIGINT, allowNull: false },
  });
  await qi.addIndex('limit_hits', ['key', 'name', 'expires_at']);
  await qi.addIndex('limit_hits', ['expires_at']);
  await qi.createTable('limit_blocks', {
    key: { type: DataTypes.STRING(300), allowNull: false, primaryKey: true },
    name: { type: DataTypes.STRING(60), allowNull: false, primaryKey: true },
    until: { type: DataTypes.BIGINT, allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  if (qi.sequelize.getDialect() !== 'postgres') return;
  await qi.dropTable('limit_blocks');
  await qi.dropTable('limit_hits');
  await qi.dropTable('sessions');
}
