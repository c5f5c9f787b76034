import { Injectable, type OnModuleInit } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { migrateOnce } from './migrator.js';
import { CONNECTION_PRAGMAS, preparePragmasOnConnect } from './sqlite-pragmas.js';
import { queueTransactions } from './transaction-queue.js';

/** Prepares connections and brings the schema up to date before anything serves. */
@Injectable()
export class DatabaseService implements OnModuleInit {
  constructor(@InjectConnection() private readonly sequelize: Sequelize) {}

  async onModuleInit(): Promise<void> {
    if (this.sequelize.getDialect() === 'sqlite') {
      preparePragmasOnConnect(this.sequelize);
      // SQLite has one writer per file; PostgreSQL runs concurrent transactions itself.
      queueTransactions(this.sequelize);
      // The default connection was opened by the module's authenticate() before the wrap.
      for (const pragma of CONNECTION_PRAGMAS) await this.sequelize.query(pragma);
    }
    await migrateOnce(this.sequelize);
  }

  /** A cheap statement that fails when the database cannot be read. */
  async ping(): Promise<void> {
    await this.sequelize.query(
      this.sequelize.getDialect() === 'sqlite' ? 'PRAGMA schema_version' : 'SELECT 1',
    );
  }
}
