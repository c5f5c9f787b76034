import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { Injectable, Logger, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import connectPgSimple from 'connect-pg-simple';
import connectSqlite3 from 'connect-sqlite3';
import session from 'express-session';
import pg from 'pg';
import sqlite3 from 'sqlite3';
import type { AppConfig } from '../config/app.config.js';
import { CONNECTION_PRAGMAS } from '../database/sqlite-pragmas.js';
import { SessionReadCache } from './session-read-cache.js';

const SQLiteStore = connectSqlite3(session);
const PgStore = connectPgSimple(session);

/**
 * Rolling sessions touch the store on every request. Extending a 30-minute idle limit
 * once a minute is as good, and saves a database write on nearly every request.
 */
function throttleTouches(store: session.Store, intervalMs: number): session.Store {
  const touch = store.touch?.bind(store);
  if (!touch) return store;
  const last = new Map<string, number>();
  store.touch = (sid, sess, callback) => {
    const now = Date.now();
    if (now - (last.get(sid) ?? 0) < intervalMs) return callback?.();
    if (last.size > 10_000) last.clear();
    last.set(sid, now);
    touch(sid, sess, callback);
  };
  return store;
}

/**
 * Sessions in their own SQLite file, on one connection prepared like the main database's; or,
 * with DATABASE_URL, in PostgreSQL's `sessions` table (connect-pg-simple; migration 0010), so
 * every process behind the load balancer knows every sign-in.
 */
@Injectable()
export class SessionStoreService implements OnApplicationShutdown {
  private readonly sqlite: sqlite3.Database | undefined;
  private readonly pool: pg.Pool | undefined;
  private readonly logger = new Logger('Sessions');
  private readonly reads: SessionReadCache | undefined;
  readonly store: session.Store;

  constructor(config: ConfigService) {
    const app = config.getOrThrow<AppConfig>('app');
    const touchEvery = Math.min(60_000, app.session.idleMs / 10);
    if (app.databaseUrl) {
      this.pool = new pg.Pool({ connectionString: app.databaseUrl, max: 4 });
      // An idle connection the server dropped (a restart, pg_terminate_backend) is let go and
      // a new one made at the next request; without a listener the 'error' would end the process.
      this.pool.on('error', (e) => this.logger.warn(`a sessions connection closed: ${e.message}`));
      this.store = throttleTouches(
        new PgStore({ pool: this.pool, tableName: 'sessions', createTableIfMissing: false }),
        touchEvery,
      );
      return;
    }
    const file = app.sessionsFile;
    mkdirSync(path.dirname(file), { recursive: true, mode: 0o700 });
    this.sqlite = new sqlite3.Database(file);
    // One statement at a time, so session reads never hold every libuv worker (see applyPragmas).
    this.sqlite.serialize();
    // sqlite3 queues statements in order, so these run before the store's CREATE TABLE.
    // Sessions can afford NORMAL: WAL still survives a process kill, and a power cut at
    // worst signs someone out, so no fsync is spent on every request.
    this.sqlite.exec(
      [
        ...CONNECTION_PRAGMAS.filter((p) => !p.includes('synchronous')),
        'PRAGMA synchronous = NORMAL',
      ].join(';\n'),
    );
    // This process alone uses the file, so what it last read or wrote is kept in memory too.
    const store = new SQLiteStore({ db: this.sqlite });
    this.reads = new SessionReadCache(store);
    this.store = throttleTouches(store, touchEvery);
  }

  /** The SQLite sessions file's connection (tests read it); there is none on PostgreSQL. */
  get db(): sqlite3.Database {
    if (!this.sqlite) throw new Error('Sessions are in PostgreSQL: use count() or the pool');
    return this.sqlite;
  }

  /** How many sessions are stored, signed in or not. */
  async count(): Promise<number> {
    if (this.pool) {
      const { rows } = await this.pool.query<{ n: number }>(
        'SELECT COUNT(*)::int AS n FROM sessions',
      );
      return rows[0]!.n;
    }
    return new Promise((resolve, reject) =>
      this.db.get<{ n: number }>('SELECT COUNT(*) AS n FROM sessions', (err, row) =>
        err ? reject(err) : resolve(row!.n),
      ),
    );
  }

  /** Ends every session of these users (passport keeps the user id in the session), but `exceptSid`. */
  destroyForUsers(userIds: readonly number[], exceptSid = ''): Promise<void> {
    if (userIds.length === 0) return Promise.resolve();
    if (this.pool) {
      return this.pool
        .query(
          `DELETE FROM sessions WHERE sess -> 'passport' ->> 'user' = ANY($1::text[]) AND sid <> $2`,
          [userIds.map(String), exceptSid],
        )
        .then(() => undefined);
    }
    const marks = userIds.map(() => '?').join(', ');
    return new Promise((resolve, reject) =>
      this.db.run(
        `DELETE FROM sessions WHERE json_extract(sess, '$.passport.user') IN (${marks}) AND sid != ?`,
        [...userIds, exceptSid],
        (err) => {
          this.reads?.forgetAll();
          return err ? reject(err) : resolve();
        },
      ),
    );
  }

  async onApplicationShutdown(): Promise<void> {
    if (this.pool) {
      await (this.store as unknown as { close(): Promise<void> }).close();
      await this.pool.end();
      return;
    }
    return new Promise((resolve) => this.db.close(() => resolve()));
  }
}
