import { Controller, Get, NotFoundException } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { Public } from '../common/decorators/public.decorator.js';
import { MailService } from './mail.service.js';
import type { OutboxStore } from './outbox.store.js';

export const NO_OUTBOX =
  'There is no dev outbox: mail goes to the SMTP relay at SMTP_URL, not to the fake server';

/** A development tool: open to anyone while the fake server is in use (see src/mail/README.md). */
@ApiTags('mail')
@Controller('dev')
export class DevOutboxController {
  constructor(private readonly mail: MailService) {}

  @Public()
  @Get('outbox')
  @ApiOperation({ summary: 'Mail caught by the fake SMTP server, newest first (fake server only)' })
  async findAll() {
    const items = await outboxOrNotFound(this.mail.outbox).list();
    return { items, total: items.length };
  }
}

export function outboxOrNotFound(outbox: OutboxStore | undefined): OutboxStore {
  if (!outbox) throw new NotFoundException(NO_OUTBOX);
  return outbox;
}
