import type sqlite3 from 'sqlite3';

type Callback = (this: unknown, err: Error | null, rows?: unknown) => void;
type Params = readonly unknown[] | Record<string, unknown>;

/** The parts of a node-sqlite3 connection this wraps. */
export interface StatementConnection {
  all(sql: string, ...rest: unknown[]): unknown;
  run(sql: string, ...rest: unknown[]): unknown;
  prepare(sql: string, callback: (err: Error | null) => void): sqlite3.Statement;
  close(callback?: (err: Error | null) => void): unknown;
}

/** Transaction control exactly as Sequelize's SQLite dialect sends it: the same text each time. */
const TRANSACTION_CONTROL = /^(BEGIN (DEFERRED|IMMEDIATE|EXCLUSIVE) TRANSACTION|COMMIT|ROLLBACK);$/;

/** At most this many statements are kept per connection, the least recently used let go first. */
export const MAX_KEPT_STATEMENTS = 200;

const wrapped = new WeakSet<object>();

/**
 * Keeps a connection's statements compiled, by their SQL. node-sqlite3 compiles a statement and
 * runs it as two trips through the thread pool, and each trip ends with a turn of the event
 * loop; a kept statement makes one. Compiling is also about a third of a small read's CPU
 * (0.28 → 0.17 ms per query, measured on this machine). On the write connection the turns are
 * what a transaction holds the write lock for while the event loop is busy, so BEGIN and COMMIT
 * are kept too.
 *
 * Kept: SQL with bound parameters (the same text for every value) and transaction control.
 * SQL with values written into it (Sequelize's WHERE clauses) would be used once: it is not.
 * A statement read to its end has let its snapshot go (SQLite ends a finished statement's read),
 * so a kept one sees every later commit; one that failed is let go. `close` finalizes them all
 * first, as a connection with statements still open cannot close. Transaction control waits
 * for the statements sent before it (ControlAfterStatements).
 */
export function keepStatements(connection: StatementConnection): void {
  if (wrapped.has(connection)) return;
  wrapped.add(connection);
  const kept = new KeptStatements(connection);
  const order = new ControlAfterStatements();
  for (const method of ['all', 'run'] as const) {
    const direct = connection[method].bind(connection);
    connection[method] = (sql: string, ...rest: unknown[]) => {
      const [params, callback] = rest as [Params, Callback];
      if (rest.length !== 2 || typeof callback !== 'function') return direct(sql, ...rest);
      const send = (done: Callback) => {
        if (kept.closed || !keepable(sql, params)) return direct(sql, params, done);
        const { statement, ready } = kept.get(sql);
        ready.then(
          () =>
            (statement[method] as (p: Params, cb: Callback) => void)(params, function (err, rows) {
              if (err) kept.drop(sql, statement);
              done.call(this, err, rows);
            }),
          (err: Error) => done.call(statement, err),
        );
      };
      order.send(TRANSACTION_CONTROL.test(sql), send, callback);
      return connection;
    };
  }
  const close = connection.close.bind(connection);
  connection.close = (callback?: (err: Error | null) => void) => {
    void kept.finalizeAll().then(() => close(callback));
    return connection;
  };
}

/**
 * Holds BEGIN, COMMIT and ROLLBACK until the statements already sent on the connection are
 * answered. Kept statements, and any on a connection left in parallel mode, run on the worker
 * threads in whatever order they get the connection: a ROLLBACK after one of two inserts sent
 * together failed could otherwise run before the other, which would then commit on its own.
 */
class ControlAfterStatements {
  private running = 0;
  private readonly held: (() => void)[] = [];

  send(control: boolean, send: (done: Callback) => void, callback: Callback): void {
    const go = () => {
      this.running++;
      const finished = () => this.finished();
      try {
        // `this` is node-sqlite3's statement: Sequelize reads lastID and changes from it.
        send(function (err, rows) {
          finished();
          callback.call(this, err, rows);
        });
      } catch (err) {
        // Refused before it was sent (a closed connection): nothing of it is running.
        finished();
        throw err;
      }
    };
    if (control && this.running > 0) this.held.push(go);
    else go();
  }

  private finished(): void {
    if (--this.running === 0) for (const go of this.held.splice(0)) go();
  }
}

interface Prepared {
  statement: sqlite3.Statement;
  /** Settles when SQLite has compiled the SQL: a mistake in it is this promise's error. */
  ready: Promise<void>;
}

/** One connection's kept statements, least recently used first. */
class KeptStatements {
  closed = false;
  private readonly bySql = new Map<string, Prepared>();

  constructor(private readonly connection: StatementConnection) {}

  get(sql: string): Prepared {
    const found = this.bySql.get(sql);
    if (found) {
      this.bySql.delete(sql);
      this.bySql.set(sql, found);
      return found;
    }
    if (this.bySql.size >= MAX_KEPT_STATEMENTS) {
      const [oldest, first] = this.bySql.entries().next().value!;
      this.drop(oldest, first.statement);
    }
    let statement!: sqlite3.Statement;
    const ready = new Promise<void>((resolve, reject) => {
      statement = this.connection.prepare(sql, (err) => (err ? reject(err) : resolve()));
    });
    this.bySql.set(sql, { statement, ready });
    // SQL that does not compile is not kept: the caller gets SQLite's message each time.
    ready.catch(() => this.drop(sql, statement));
    return { statement, ready };
  }

  /** Lets a statement go (finalizing waits for its calls already queued). */
  drop(sql: string, statement: sqlite3.Statement): void {
    if (this.bySql.get(sql)?.statement !== statement) return;
    this.bySql.delete(sql);
    void finalize(statement);
  }

  /** Finalizes every kept statement; later calls compile each time. */
  async finalizeAll(): Promise<void> {
    this.closed = true;
    const all = [...this.bySql.values()];
    this.bySql.clear();
    await Promise.all(all.map((p) => finalize(p.statement)));
  }
}

function keepable(sql: string, params: Params): boolean {
  const bound = Array.isArray(params) ? params.length : Object.keys(params ?? {}).length;
  return bound > 0 || TRANSACTION_CONTROL.test(sql);
}

function finalize(statement: sqlite3.Statement): Promise<void> {
  return new Promise((resolve) => statement.finalize(() => resolve()));
}
