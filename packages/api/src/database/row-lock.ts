import type { FindOptions, Model, ModelStatic, Transaction } from 'sequelize';

/**
 * Sequelize's `lock` for a read that takes its row first in a transaction, until the transaction
 * ends: `SELECT … FOR NO KEY UPDATE OF` the model's table, where the database locks rows
 * (PostgreSQL). Two requests changing one parent row's children at once (a double tap, a retry,
 * two parents) then go in turn, and the second reads what the first committed instead of what
 * was there before it. NO KEY UPDATE rather than UPDATE: inserts elsewhere that name the row (a
 * miss naming its student, a sitting its key) take only the KEY SHARE lock it leaves free, so
 * they neither wait for it nor deadlock with it. SQLite ignores it: this process's write queue
 * already runs its write transactions one at a time (database/transaction-queue.ts).
 */
export function rowLock(transaction: Transaction, model: ModelStatic<Model>): FindOptions['lock'] {
  return { level: transaction.LOCK.NO_KEY_UPDATE, of: model };
}
