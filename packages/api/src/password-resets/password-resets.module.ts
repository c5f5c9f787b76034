import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuthModule } from '../auth/auth.module.js';
import { LimitsModule } from '../common/limits/limits.module.js';
import { MailModule } from '../mail/mail.module.js';
import { UsersModule } from '../users/users.module.js';
import { PasswordResetToken } from './models/password-reset-token.model.js';
import { PasswordResetsController } from './password-resets.controller.js';
import { PasswordResetsService } from './password-resets.service.js';

@Module({
  imports: [
    SequelizeModule.forFeature([PasswordResetToken]),
    AuthModule,
    UsersModule,
    MailModule,
    LimitsModule,
  ],
  controllers: [PasswordResetsController],
  providers: [PasswordResetsService],
})
export class PasswordResetsModule {}
