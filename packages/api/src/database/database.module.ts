import { Global, Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SequelizeModule } from '@nestjs/sequelize';
import { Transaction } from 'sequelize';
import type { AppConfig } from '../config/app.config.js';
import { DatabaseService } from './database.service.js';
import { InsertsService } from './inserts.service.js';
import { MODELS } from './models.js';
import { SqlReader } from './sql-reader.js';

@Global()
@Module({
  imports: [
    SequelizeModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService) => {
        const app = config.getOrThrow<AppConfig>('app');
        const common = {
          models: MODELS,
          logging: false,
          retryAttempts: 0,
          define: { underscored: true },
        };
        if (app.databaseUrl) {
          // Several processes share the server: each keeps a small pool of connections.
          return {
            ...common,
            dialect: 'postgres' as const,
            uri: app.databaseUrl,
            pool: { max: 10, min: 0, idle: 10_000 },
          };
        }
        return {
          ...common,
          dialect: 'sqlite' as const,
          storage: app.databaseFile,
          // IMMEDIATE takes the write lock up front, so two writers wait on
          // busy_timeout instead of failing on a read-to-write upgrade.
          transactionType: Transaction.TYPES.IMMEDIATE,
        };
      },
    }),
  ],
  providers: [DatabaseService, InsertsService, SqlReader],
  exports: [DatabaseService, InsertsService, SqlReader],
})
export class DatabaseModule {}
