import { Module } from '@nestjs/common';
import { PassportModule } from '@nestjs/passport';
import { EmailVerificationsModule } from '../email-verifications/email-verifications.module.js';
import { HouseholdsModule } from '../households/households.module.js';
import { UsersModule } from '../users/users.module.js';
import { AuthController } from './auth.controller.js';
import { AuthService } from './auth.service.js';
import { LocalStrategy } from './local.strategy.js';
import { PasswordService } from './password.service.js';
import { SessionSerializer } from './session.serializer.js';

@Module({
  imports: [
    PassportModule.register({ session: true }),
    UsersModule,
    HouseholdsModule,
    EmailVerificationsModule,
  ],
  controllers: [AuthController],
  providers: [AuthService, PasswordService, LocalStrategy, SessionSerializer],
  // Sign-up and invitations both mail the address-confirmation link.
  exports: [AuthService, PasswordService, EmailVerificationsModule],
})
export class AuthModule {}
