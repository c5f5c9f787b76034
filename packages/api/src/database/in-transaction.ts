import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';

/**
 * Whether queries may be sent side by side. Outside a transaction they may: each takes its own
 * connection. In one they may on SQLite, whose write connection answers them in turn (and each
 * turn of the event loop between them is time the write queue waits), but not on PostgreSQL:
 * there a transaction is one client, which runs one query at a time, and a query sent while
 * another runs is queued by pg with a deprecation warning, and refused from pg 9.
 */
export function queriesSideBySide(sequelize: Sequelize, transaction?: Transaction): boolean {
  return !transaction || sequelize.getDialect() === 'sqlite';
}

/**
 * Queries that may share `transaction`, answered in order: side by side where
 * `queriesSideBySide`, else one after another.
 */
export async function allQueries<T extends readonly unknown[]>(
  sequelize: Sequelize,
  transaction: Transaction | undefined,
  queries: { readonly [K in keyof T]: () => PromiseLike<T[K]> },
): Promise<T> {
  if (queriesSideBySide(sequelize, transaction)) {
    return Promise.all(queries.map((query) => query())) as unknown as Promise<T>;
  }
  const results: unknown[] = [];
  for (const query of queries) results.push(await query());
  return results as unknown as T;
}
