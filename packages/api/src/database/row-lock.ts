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

/** A service's `findModel(…, { lock: true })`: its read takes the row, inside a transaction. */
export interface FindLock {
  lock?: boolean;
}

/** The `lock` option for a find asked to lock (FindLock): rowLock inside a transaction. */
export function lockIf(
  { lock = false }: FindLock,
  transaction: Transaction | undefined,
  model: ModelStatic<Model>,
): FindOptions['lock'] {
  return lock && transaction ? rowLock(transaction, model) : undefined;
}

/** Row `id` of `model`, taken with rowLock (null when it is gone): for a check that needs no scope. */
export function lockRow<M extends Model>(
  model: ModelStatic<M>,
  id: number,
  transaction: Transaction,
): Promise<M | null> {
  return model.findByPk(id, { transaction, lock: rowLock(transaction, model) });
}
