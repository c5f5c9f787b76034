import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuthModule } from '../auth/auth.module.js';
import { LimitsModule } from '../common/limits/limits.module.js';
import { HouseholdsModule } from '../households/households.module.js';
import { MailModule } from '../mail/mail.module.js';
import { StudentsModule } from '../students/students.module.js';
import { UsersModule } from '../users/users.module.js';
import { InvitationAcceptanceService } from './invitation-acceptance.service.js';
import { InvitationsController } from './invitations.controller.js';
import { InvitationsService } from './invitations.service.js';
import { Invitation } from './models/invitation.model.js';

@Module({
  imports: [
    SequelizeModule.forFeature([Invitation]),
    AuthModule,
    HouseholdsModule,
    StudentsModule,
    UsersModule,
    MailModule,
    LimitsModule,
  ],
  controllers: [InvitationsController],
  providers: [InvitationsService, InvitationAcceptanceService],
  exports: [InvitationsService, InvitationAcceptanceService],
})
export class InvitationsModule {}
