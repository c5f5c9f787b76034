import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { Injectable, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import connectSqlite3 from 'connect-sqlite3';
import session from 'express-session';
import sqlite3 from 'sqlite3';
import type { AppConfig } from '../config/app.config.js';
import { CONNECTION_PRAGMAS } from '../database/sqlite-pragmas.js';

const SQLiteStore = connectSqlite3(session);

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

/** Sessions in their own SQLite file, on one connection prepared like the main database's. */
@Injectable()
export class SessionStoreService implements OnApplicationShutdown {
  readonly db: sqlite3.Database;
  readonly store: session.Store;

  constructor(config: ConfigService) {
    const file = config.getOrThrow<AppConfig>('app').sessionsFile;
    mkdirSync(path.dirname(file), { recursive: true, mode: 0o700 });
    this.db = new sqlite3.Database(file);
    // One statement at a time, so session reads never hold every libuv worker (see applyPragmas).
    this.db.serialize();
    // sqlite3 queues statements in order, so these run before the store's CREATE TABLE.
    // Sessions can afford NORMAL: WAL still survives a process kill, and a power cut at
    // worst signs someone out, so no fsync is spent on every request.
    this.db.exec(
      [
        ...CONNECTION_PRAGMAS.filter((p) => !p.includes('synchronous')),
        'PRAGMA synchronous = NORMAL',
      ].join(';\n'),
    );
    const idleMs = config.getOrThrow<AppConfig>('app').session.idleMs;
    this.store = throttleTouches(new SQLiteStore({ db: this.db }), Math.min(60_000, idleMs / 10));
  }

  /** Ends every session of these users (passport keeps the user id in the session), but `exceptSid`. */
  destroyForUsers(userIds: readonly number[], exceptSid = ''): Promise<void> {
    if (userIds.length === 0) return Promise.resolve();
    const marks = userIds.map(() => '?').join(', ');
    return new Promise((resolve, reject) =>
      this.db.run(
        `DELETE FROM sessions WHERE json_extract(sess, '$.passport.user') IN (${marks}) AND sid != ?`,
        [...userIds, exceptSid],
        (err) => (err ? reject(err) : resolve()),
      ),
    );
  }

  onApplicationShutdown(): Promise<void> {
    return new Promise((resolve) => this.db.close(() => resolve()));
  }
}
