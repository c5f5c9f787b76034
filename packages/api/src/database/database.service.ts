import { Injectable, type OnModuleInit } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { createMigrator } from './migrator.js';
import { CONNECTION_PRAGMAS, preparePragmasOnConnect } from './sqlite-pragmas.js';
import { queueTransactions } from './transaction-queue.js';

/** Prepares connections and brings the schema up to date before anything serves. */
@Injectable()
export class DatabaseService implements OnModuleInit {
  constructor(@InjectConnection() private readonly sequelize: Sequelize) {}

  async onModuleInit(): Promise<void> {
    preparePragmasOnConnect(this.sequelize);
    queueTransactions(this.sequelize);
    // The default connection was opened by the module's authenticate() before the wrap.
    for (const pragma of CONNECTION_PRAGMAS) await this.sequelize.query(pragma);
    await createMigrator(this.sequelize).up();
  }

  async pragma(name: string): Promise<unknown> {
    const [rows] = await this.sequelize.query(`PRAGMA ${name}`);
    return rows;
  }
}
