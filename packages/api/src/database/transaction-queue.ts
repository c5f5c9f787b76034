import { AsyncLocalStorage } from 'node:async_hooks';
import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';

type Work<T> = (transaction: Transaction) => PromiseLike<T>;

/** Runs work on the write connection with no transaction of this process beside it. */
export interface WriteQueue {
  alone<T>(work: () => Promise<T>): Promise<T>;
}

/**
 * Runs this process's write transactions one after another. SQLite has one writer at a time;
 * when many `BEGIN IMMEDIATE` waited on busy_timeout together, each waiter slept on a libuv
 * worker thread, and with all four taken the transaction holding the lock could not run its
 * next statement until the waiters gave up with SQLITE_BUSY. Queued here they wait in
 * JavaScript instead; busy_timeout is left to writers in other processes (a backup).
 * Returns the queue, for writes that send their own BEGIN and COMMIT (SqliteInserts).
 */
export function queueTransactions(
  sequelize: Sequelize,
  { guardNesting = true }: { guardNesting?: boolean } = {},
): WriteQueue {
  const begin = sequelize.transaction.bind(sequelize) as <T>(
    options: object,
    work: Work<T>,
  ) => Promise<T>;
  const inside = new AsyncLocalStorage<true>();
  let last: Promise<unknown> = Promise.resolve();
  // While a store is enabled, Node 20 runs an async hook on every promise in the process, reads
  // included. It is enabled only while a transaction is queued or running, and only where
  // `guardNesting` asks for the check (development and tests): with many families logging at
  // once some transaction nearly always is, and production pays for every promise.
  let queued = 0;
  const settled = () => {
    if (--queued === 0 && guardNesting) inside.disable();
  };

  function enqueue<T>(work: () => PromiseLike<T>): Promise<T> {
    // Waiting for the queue from inside a queued transaction would wait for ever.
    if (inside.getStore()) {
      throw new Error('A transaction was opened inside another: pass the outer one instead');
    }
    queued++;
    const run = last.then(() => (guardNesting ? inside.run(true, work) : work()));
    last = run.then(settled, settled);
    return run;
  }

  function transaction<T>(optionsOrWork: object | Work<T>, maybeWork?: Work<T>): Promise<T> {
    const [options, work] =
      typeof optionsOrWork === 'function' ? [{}, optionsOrWork] : [optionsOrWork, maybeWork];
    if (!work) throw new Error('Use managed transactions: sequelize.transaction(async (t) => …)');
    return enqueue(() => begin<T>(options, work as Work<T>));
  }
  sequelize.transaction = transaction as Sequelize['transaction'];
  return { alone: enqueue };
}
