import type { Sequelize } from 'sequelize-typescript';
import { keepStatements, type StatementConnection } from './sqlite-statements.js';
import type { TableInfoCache } from './sqlite-table-info-cache.js';

/**
 * Pragmas every connection needs. Sequelize's sqlite dialect opens a fresh
 * connection per transaction and runs no connect hooks, so they are applied
 * whenever it hands out a connection it has not seen before.
 *
 * synchronous=FULL: in WAL mode this syncs the log on every commit, so a
 * transaction that answered 2xx survives a power cut, not only a process kill
 * (NORMAL would survive the kill but may lose the last commits on power loss).
 */
export const CONNECTION_PRAGMAS = [
  'PRAGMA journal_mode = WAL',
  'PRAGMA foreign_keys = ON',
  'PRAGMA busy_timeout = 10000',
  'PRAGMA synchronous = FULL',
] as const;

/** A node-sqlite3 connection as Sequelize's connection manager hands it out. */
export interface RawConnection extends StatementConnection {
  exec(sql: string, callback: (err: Error | null) => void): void;
  serialize(): void;
}

const prepared = new WeakSet<object>();

/** Runs SQL (one statement or several) on a node-sqlite3 connection. */
export function exec(connection: RawConnection, sql: string): Promise<void> {
  return new Promise((resolve, reject) =>
    connection.exec(sql, (err) => (err ? reject(err) : resolve())),
  );
}

/**
 * `serialize`: one statement at a time on this connection. In node-sqlite3's default parallel
 * mode every queued statement takes a libuv worker thread and waits there on the connection's
 * mutex, so a busy shared connection can hold the workers other connections and file I/O need.
 * The write connection is left parallel: the transaction queue lets one transaction at a time
 * send to it, and the statements it sends together (independent reads or inserts) then run one
 * after another on the worker threads, where a serialized connection would wait a turn of the
 * busy event loop between each, holding the write lock.
 */
export async function applyPragmas(
  connection: RawConnection,
  { serialize = true }: { serialize?: boolean } = {},
): Promise<void> {
  if (prepared.has(connection)) return;
  if (serialize) connection.serialize();
  for (const pragma of CONNECTION_PRAGMAS) await exec(connection, pragma);
  prepared.add(connection);
}

/** Connections kept for reads outside transactions, beside the one Sequelize keeps for writes. */
export const READ_CONNECTIONS = 4;

interface ConnectionOptions {
  uuid?: string;
  type?: string;
  transaction?: unknown;
}

/**
 * Wraps the dialect's getConnection so each new connection is prepared before use, and its
 * column-type lookups go through `tableInfo`.
 *
 * Sequelize's SQLite dialect sends every query outside a transaction down one connection, and
 * node-sqlite3 runs a connection's statements one at a time: with many families at once, a
 * request's reads queued behind everyone else's. WAL lets readers on other connections run
 * beside each other and beside the writer, each seeing every commit made before it starts, so
 * plain SELECTs take turns over a few connections of their own (kept open like the default one).
 *
 * The dialect also opened a new connection for every transaction and closed it after: a file
 * open, the pragmas and a read of the schema each time, all while holding the write lock.
 * Transactions run one at a time in this process (queueTransactions), so they share one kept
 * `write` connection instead; it is let go only if Sequelize gives up on it after an error.
 */
export function preparePragmasOnConnect(sequelize: Sequelize, tableInfo: TableInfoCache): void {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options?: ConnectionOptions): Promise<RawConnection>;
    releaseConnection(connection: RawConnection): void;
    destroyConnection(connection: RawConnection): Promise<void>;
    connections: Record<string, RawConnection>;
    _onProcessExit(): Promise<void>;
  };
  const original = manager.getConnection.bind(manager);
  const release = manager.releaseConnection.bind(manager);
  const destroy = manager.destroyConnection.bind(manager);
  const closeAll = manager._onProcessExit.bind(manager);
  // Sequelize closes its connections all at once; the last to close checkpoints the WAL and
  // removes it, and two closing together can each leave that to the other. The read and write
  // connections close first, one at a time, and Sequelize's own last.
  manager._onProcessExit = async () => {
    for (const [key, connection] of Object.entries(manager.connections)) {
      if (key === 'default') continue;
      delete manager.connections[key];
      await new Promise<void>((resolve) => connection.close(() => resolve()));
    }
    return closeAll();
  };
  const inMemory = (sequelize.options.storage ?? ':memory:') === ':memory:';
  let turn = 0;
  manager.getConnection = async (options?: ConnectionOptions) => {
    if (
      !inMemory &&
      options &&
      !options.uuid &&
      !options.transaction &&
      options.type === 'SELECT'
    ) {
      options.uuid = `read-${turn++ % READ_CONNECTIONS}`;
    }
    // A transaction asks by its own id (transaction.js prepareEnvironment).
    const forTransaction =
      !inMemory &&
      !!options?.uuid &&
      options.uuid !== 'default' &&
      !options.uuid.startsWith('read-');
    const connection = await original(forTransaction ? { ...options, uuid: WRITE } : options);
    await applyPragmas(connection, { serialize: !forTransaction });
    tableInfo.wrap(connection);
    keepStatements(connection);
    return connection;
  };
  // The transaction's end: the write connection stays open for the next one.
  manager.releaseConnection = (connection) => {
    if (connection !== manager.connections[WRITE]) release(connection);
  };
  // After a failed rollback Sequelize destroys the connection: a fresh one opens next time.
  manager.destroyConnection = async (connection) => {
    if (connection !== manager.connections[WRITE]) return destroy(connection);
    delete manager.connections[WRITE];
    await new Promise<void>((resolve) => connection.close(() => resolve()));
  };
}

/** The key of the connection transactions share. */
const WRITE = 'write';

/** The connection transactions share, for writes that send their own BEGIN and COMMIT. */
export function writeConnection(sequelize: Sequelize): Promise<RawConnection> {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options: ConnectionOptions): Promise<RawConnection>;
  };
  return manager.getConnection({ uuid: WRITE });
}
