import type sqlite3 from 'sqlite3';
import type { SqlParam } from './sql-reader.js';

interface Prepared {
  statement: sqlite3.Statement;
  /** Settles when SQLite has compiled the SQL: a mistake in it is this promise's error. */
  ready: Promise<void>;
}

/**
 * SELECTs kept compiled on the connections SqlReader reads through, by their SQL. Compiling
 * is about a third of a small read's CPU (0.28 → 0.17 ms per query, measured on this machine),
 * and a notebook page makes the same few reads again and again. A statement read to its end
 * has let its snapshot go (SQLite ends a finished statement's read), so a kept one sees every
 * later commit. At most MAX_PER_CONNECTION per connection, the oldest let go first; `close`
 * lets all of them go, as a connection with statements still open cannot close.
 */
export class SqliteStatements {
  static readonly MAX_PER_CONNECTION = 200;
  private readonly byConnection = new Map<sqlite3.Database, Map<string, Prepared>>();
  private closed = false;

  all<T>(connection: sqlite3.Database, sql: string, params: readonly SqlParam[]): Promise<T[]> {
    if (this.closed) {
      return new Promise<T[]>((resolve, reject) =>
        connection.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))),
      );
    }
    const prepared = this.preparedOn(connection, sql);
    return prepared.ready.then(
      () =>
        new Promise<T[]>((resolve, reject) =>
          prepared.statement.all(params, (err: Error | null, rows: unknown[]) =>
            err ? reject(err) : resolve(rows as T[]),
          ),
        ),
    );
  }

  /** Finalizes every kept statement; later reads compile each time. */
  async close(): Promise<void> {
    this.closed = true;
    const all = [...this.byConnection.values()].flatMap((kept) => [...kept.values()]);
    this.byConnection.clear();
    await Promise.all(all.map((p) => finalize(p.statement)));
  }

  private preparedOn(connection: sqlite3.Database, sql: string): Prepared {
    let kept = this.byConnection.get(connection);
    if (!kept) this.byConnection.set(connection, (kept = new Map()));
    const found = kept.get(sql);
    if (found) return found;
    if (kept.size >= SqliteStatements.MAX_PER_CONNECTION) {
      const [oldest, first] = kept.entries().next().value as [string, Prepared];
      kept.delete(oldest);
      // Finalizing waits for the statement's reads already queued.
      void finalize(first.statement);
    }
    let statement!: sqlite3.Statement;
    const ready = new Promise<void>((resolve, reject) => {
      statement = connection.prepare(sql, (err: Error | null) => (err ? reject(err) : resolve()));
    });
    const prepared = { statement, ready };
    kept.set(sql, prepared);
    // SQL that does not compile is not kept: the caller gets SQLite's message each time.
    ready.catch(() => {
      if (kept.get(sql) === prepared) kept.delete(sql);
    });
    return prepared;
  }
}

function finalize(statement: sqlite3.Statement): Promise<void> {
  return new Promise((resolve) => statement.finalize(() => resolve()));
}
