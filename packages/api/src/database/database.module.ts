import { Global, Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SequelizeModule } from '@nestjs/sequelize';
import { Transaction } from 'sequelize';
import type { AppConfig } from '../config/app.config.js';
import { DatabaseService } from './database.service.js';
import { MODELS } from './models.js';

@Global()
@Module({
  imports: [
    SequelizeModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService) => {
        const app = config.getOrThrow<AppConfig>('app');
        return {
          dialect: 'sqlite' as const,
          storage: app.databaseFile,
          models: MODELS,
          logging: false,
          // IMMEDIATE takes the write lock up front, so two writers wait on
          // busy_timeout instead of failing on a read-to-write upgrade.
          transactionType: Transaction.TYPES.IMMEDIATE,
          retryAttempts: 0,
          define: { underscored: true },
        };
      },
    }),
  ],
  providers: [DatabaseService],
  exports: [DatabaseService],
})
export class DatabaseModule {}
