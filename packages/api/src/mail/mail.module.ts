import { Module } from '@nestjs/common';
import { DevOutboxController } from './dev-outbox.controller.js';
import { MailService } from './mail.service.js';

@Module({
  controllers: [DevOutboxController],
  providers: [MailService],
  exports: [MailService],
})
export class MailModule {}
