import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';

/**
 * Whether queries may be sent side by side. Outside a transaction they may: each takes its own
 * connection. In one they may on SQLite, whose write connection answers them in turn (and each
 * turn of the event loop between them is time the write queue waits), but not on PostgreSQL:
 * there a transaction is one client, which runs one query at a time, and a query sent while
 * another runs is queued by pg with a deprecation warning, and refused from pg 9.
 */
function queriesSideBySide(sequelize: Sequelize, transaction?: Transaction): boolean {
  return !transaction || sequelize.getDialect() === 'sqlite';
}

/**
 * Queries (reads or writes) that may share `transaction`, answered in order: side by side where
 * `queriesSideBySide`, else one after another. Side by side, every one finishes before the
 * first failure is thrown, so none is still running when the transaction rolls back.
 */
export async function allQueries<T extends readonly unknown[]>(
  sequelize: Sequelize,
  transaction: Transaction | undefined,
  queries: { readonly [K in keyof T]: () => PromiseLike<T[K]> },
): Promise<T> {
  const results: unknown[] = [];
  if (queriesSideBySide(sequelize, transaction)) {
    const settled = await Promise.allSettled(queries.map((query) => query()));
    for (const answer of settled) {
      if (answer.status === 'rejected') throw answer.reason;
      results.push(answer.value);
    }
  } else {
    for (const query of queries) results.push(await query());
  }
  return results as unknown as T;
}
