import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { MailModule } from '../mail/mail.module.js';
import { UsersModule } from '../users/users.module.js';
import { EmailVerificationsController } from './email-verifications.controller.js';
import { EmailVerificationsService } from './email-verifications.service.js';
import { EmailVerificationToken } from './models/email-verification-token.model.js';

@Module({
  imports: [SequelizeModule.forFeature([EmailVerificationToken]), UsersModule, MailModule],
  controllers: [EmailVerificationsController],
  providers: [EmailVerificationsService],
  exports: [EmailVerificationsService],
})
export class EmailVerificationsModule {}
