import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '0008-miss-idempotency-keys';

/**
 * The key a phone sends with a miss it may send again (a draft kept offline, a retry after a
 * dropped answer), and a digest of what it sent: the same key twice in one household answers
 * the first miss; the same key with other content is refused. Misses saved without a key keep
 * NULL, which a unique index allows any number of times (SQLite and PostgreSQL alike).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('misses', 'idempotency_key', {
    type: DataTypes.STRING(100),
    allowNull: true,
  });
  await qi.addColumn('misses', 'request_digest', {
    type: DataTypes.STRING(64),
    allowNull: true,
  });
  await qi.addIndex('misses', ['household_id', 'idempotency_key'], {
    name: 'misses_household_idempotency_key',
    unique: true,
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeIndex('misses', 'misses_household_idempotency_key');
  await qi.removeColumn('misses', 'request_digest');
  await qi.removeColumn('misses', 'idempotency_key');
}
