import { Module } from '@nestjs/common';
import { ConfigModule, ConfigService } from '@nestjs/config';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { getConnectionToken } from '@nestjs/sequelize';
import { ThrottlerModule } from '@nestjs/throttler';
import type { Request } from 'express';
import type { Sequelize } from 'sequelize-typescript';
import { AnswerKeysModule } from './answer-keys/answer-keys.module.js';
import { AuthModule } from './auth/auth.module.js';
import { CheckUpsModule } from './check-ups/check-ups.module.js';
import { HttpExceptionFilter } from './common/filters/http-exception.filter.js';
import { AccessGuard } from './common/guards/access.guard.js';
import { CsrfGuard } from './common/guards/csrf.guard.js';
import { appConfig, type AppConfig } from './config/app.config.js';
import { CurriculumModule } from './curriculum/curriculum.module.js';
import { DatabaseModule } from './database/database.module.js';
import { PostgresThrottlerStorage } from './database/postgres-throttler-storage.js';
import { DiagnoseModule } from './diagnose/diagnose.module.js';
import { HealthModule } from './health/health.module.js';
import { HouseholdDataModule } from './household-data/household-data.module.js';
import { HouseholdsModule } from './households/households.module.js';
import { InvitationsModule } from './invitations/invitations.module.js';
import { MailModule } from './mail/mail.module.js';
import { MetricsModule } from './metrics/metrics.module.js';
import { MissesModule } from './misses/misses.module.js';
import { NotesModule } from './notes/notes.module.js';
import { PasswordResetsModule } from './password-resets/password-resets.module.js';
import { PatternsModule } from './patterns/patterns.module.js';
import { PhotosModule } from './photos/photos.module.js';
import { PortfolioModule } from './portfolio/portfolio.module.js';
import { ReviewPlansModule } from './review-plans/review-plans.module.js';
import { SeedModule } from './seed/seed.module.js';
import { SessionsModule } from './sessions/sessions.module.js';
import { SittingsModule } from './sittings/sittings.module.js';
import { StudentsModule } from './students/students.module.js';
import { UsersModule } from './users/users.module.js';

const emailOf = (req: Request) =>
  typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';

@Module({
  imports: [
    ConfigModule.forRoot({ isGlobal: true, ignoreEnvFile: true, load: [appConfig] }),
    ThrottlerModule.forRootAsync({
      inject: [ConfigService, getConnectionToken()],
      useFactory: (config: ConfigService, sequelize: Sequelize) => {
        const app = config.getOrThrow<AppConfig>('app');
        const limit = app.signInLimitPerMinute;
        return {
          // Every process counts in PostgreSQL when it is shared; one process counts in memory.
          storage: app.databaseUrl ? new PostgresThrottlerStorage(sequelize) : undefined,
          errorMessage: 'Too many tries: please wait a minute and try again',
          throttlers: [
            {
              name: 'sign-in',
              ttl: 60_000,
              limit,
              getTracker: (req) => `${(req as Request).ip}|${emailOf(req as Request)}`,
            },
            { name: 'sign-in-ip', ttl: 60_000, limit: limit * 6 },
          ],
        };
      },
    }),
    DatabaseModule,
    // Express tries routes in the order they were added, and Nest adds them module by module:
    // the routes asked most often (health checks, the notebook) come first.
    HealthModule,
    MissesModule,
    SessionsModule,
    UsersModule,
    HouseholdsModule,
    AuthModule,
    StudentsModule,
    DiagnoseModule,
    PhotosModule,
    CurriculumModule,
    AnswerKeysModule,
    SittingsModule,
    CheckUpsModule,
    NotesModule,
    MailModule,
    InvitationsModule,
    PasswordResetsModule,
    HouseholdDataModule,
    ReviewPlansModule,
    PatternsModule,
    PortfolioModule,
    MetricsModule,
    SeedModule,
  ],
  providers: [
    { provide: APP_GUARD, useClass: CsrfGuard },
    { provide: APP_GUARD, useClass: AccessGuard },
    { provide: APP_FILTER, useClass: HttpExceptionFilter },
  ],
})
export class AppModule {}
