import { Injectable, type OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectConnection } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { AppConfig } from '../config/app.config.js';
import { migrateOnce } from './migrator.js';
import { CONNECTION_PRAGMAS, preparePragmasOnConnect } from './sqlite-pragmas.js';
import { TableInfoCache } from './sqlite-table-info-cache.js';
import { queueTransactions, type WriteQueue } from './transaction-queue.js';

/** Prepares connections and brings the schema up to date before anything serves. */
@Injectable()
export class DatabaseService implements OnModuleInit {
  /** How long a good answer stands for the next health checks. */
  static readonly PING_FRESH_MS = 1_000;
  private lastPing: { at: number; done: Promise<void> } | undefined;
  /** SQLite's one-at-a-time queue of this process's writes (none on PostgreSQL). */
  writeQueue: WriteQueue | undefined;
  private readonly tableInfo = new TableInfoCache();

  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly config: ConfigService,
  ) {}

  async onModuleInit(): Promise<void> {
    if (this.sequelize.getDialect() === 'sqlite') {
      preparePragmasOnConnect(this.sequelize, this.tableInfo);
      // SQLite has one writer per file; PostgreSQL runs concurrent transactions itself.
      // The check for a transaction opened inside another is a developer's guard.
      this.writeQueue = queueTransactions(this.sequelize, {
        guardNesting: this.config.getOrThrow<AppConfig>('app').env !== 'production',
      });
      // The default connection was opened by the module's authenticate() before the wrap.
      for (const pragma of CONNECTION_PRAGMAS) await this.sequelize.query(pragma);
    }
    await migrateOnce(this.sequelize);
    this.tableInfo.trust();
  }

  /**
   * A cheap statement that fails when the database cannot be read. A load balancer may ask
   * many times a second: checks within a second of a good answer (or while one is on its way)
   * share it, so health costs no query of its own; a failure is never reused.
   */
  ping(): Promise<void> {
    const now = Date.now();
    if (this.lastPing && now - this.lastPing.at < DatabaseService.PING_FRESH_MS) {
      return this.lastPing.done;
    }
    const done = this.sequelize
      .query(this.sequelize.getDialect() === 'sqlite' ? 'PRAGMA schema_version' : 'SELECT 1')
      .then(() => undefined);
    const entry = { at: now, done };
    this.lastPing = entry;
    done.catch(() => {
      if (this.lastPing === entry) this.lastPing = undefined;
    });
    return done;
  }
}
