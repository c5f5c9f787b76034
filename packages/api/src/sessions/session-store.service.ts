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

/** Sessions in their own SQLite file, on one connection prepared like the main database's. */
@Injectable()
export class SessionStoreService implements OnApplicationShutdown {
  readonly db: sqlite3.Database;
  readonly store: session.Store;

  constructor(config: ConfigService) {
    const file = config.getOrThrow<AppConfig>('app').sessionsFile;
    mkdirSync(path.dirname(file), { recursive: true, mode: 0o700 });
    this.db = new sqlite3.Database(file);
    // sqlite3 queues statements in order, so these run before the store's CREATE TABLE.
    this.db.exec(CONNECTION_PRAGMAS.join(';\n'));
    this.store = new SQLiteStore({ db: this.db });
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
