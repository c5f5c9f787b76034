type Rows = readonly unknown[];
type Callback = (this: unknown, err: Error | null, rows: Rows) => void;

interface AllConnection {
  all(sql: string, ...rest: unknown[]): unknown;
}

/** `PRAGMA table_info(\`misses\`)` exactly as Sequelize's SQLite dialect writes it. */
const TABLE_INFO = /^PRAGMA table_info\(`([^`]+)`\)$/;

/**
 * Sequelize's SQLite dialect asks `PRAGMA table_info` of a SELECT's table before every SELECT,
 * to learn its column types; it keeps no answer between queries, so each read made two trips
 * through the thread pool and built a row per column. The schema changes only in migrations,
 * which run before the app serves: once `trust()` is called, each table's answer is read once
 * per process and then given from memory.
 */
export class TableInfoCache {
  private readonly tables = new Map<string, Rows>();
  private readonly wrapped = new WeakSet<object>();
  private trusted = false;

  /** The schema is final (migrations ran): answers may be kept from now on. */
  trust(): void {
    this.tables.clear();
    this.trusted = true;
  }

  /** Wraps a node-sqlite3 connection's `all` so table_info is answered from the cache. */
  wrap(connection: AllConnection): void {
    if (this.wrapped.has(connection)) return;
    this.wrapped.add(connection);
    const all = connection.all.bind(connection);
    connection.all = (sql: string, ...rest: unknown[]) => {
      const table = this.trusted && rest.length === 1 ? TABLE_INFO.exec(sql)?.[1] : undefined;
      if (table === undefined) return all(sql, ...rest);
      const done = rest[0] as Callback;
      const known = this.tables.get(table);
      if (known) {
        process.nextTick(() => done.call(connection, null, known));
        return connection;
      }
      return all(sql, (err: Error | null, rows: Rows) => {
        if (!err && this.trusted) this.tables.set(table, rows);
        done.call(connection, err, rows);
      });
    };
  }
}
