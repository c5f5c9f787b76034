import type { FindOptions, Model, ModelStatic, Transaction } from 'sequelize';

/**
 * Sequelize's `lock` for a read that takes its row first in a transaction, until the transaction
 * ends: `SELECT … FOR UPDATE OF` the model's table, where the database locks rows (PostgreSQL).
 * Two requests changing one parent row's children at once (a double tap, a retry, two parents)
 * then go in turn, and the second reads what the first committed instead of what was there
 * before it. SQLite ignores it: this process's write queue already runs its write transactions
 * one at a time (database/transaction-queue.ts).
 */
export function rowLock(transaction: Transaction, model: ModelStatic<Model>): FindOptions['lock'] {
  return { level: transaction.LOCK.UPDATE, of: model };
}
