import path from 'node:path';
import {
  Injectable,
  Logger,
  type OnApplicationShutdown,
  type OnModuleInit,
  ServiceUnavailableException,
} from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/app.config.js';
import { FakeSmtpServer } from './fake-smtp-server.js';
import { composeLetter, type Letter } from './letter.js';
import { type Mailer, SmtpMailer } from './mailer.js';
import { OutboxStore } from './outbox.store.js';

/**
 * Sends Workback's e-mail. With SMTP_URL set it goes to that relay; without
 * it (development, tests, the demo) a fake SMTP server runs in-process, mail
 * is really sent to it over SMTP, and what it caught lands in DATA_DIR/outbox.
 */
@Injectable()
export class MailService implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger(MailService.name);
  private readonly config: AppConfig;
  private mailer: Mailer | undefined;
  private fake: FakeSmtpServer | undefined;
  /** Set only while the fake server is in use. */
  readonly outbox: OutboxStore | undefined;

  constructor(config: ConfigService) {
    this.config = config.getOrThrow<AppConfig>('app');
    // Never in production: the outbox holds reset and invitation links and answers anyone.
    if (!this.config.mail.smtpUrl && this.config.env !== 'production')
      this.outbox = new OutboxStore(path.join(this.config.dataDir, 'outbox'));
  }

  async onModuleInit(): Promise<void> {
    const { smtpUrl, from } = this.config.mail;
    if (smtpUrl) {
      this.mailer = new SmtpMailer(smtpUrl, from);
      return;
    }
    const outbox = this.outbox;
    if (!outbox) throw new Error('SMTP_URL must be set in production');
    this.fake = new FakeSmtpServer(async (raw, recipients) => {
      await outbox.save(raw, recipients);
    });
    const port = await this.fake.start();
    this.mailer = new SmtpMailer({ host: '127.0.0.1', port, secure: false, ignoreTLS: true }, from);
  }

  async onApplicationShutdown(): Promise<void> {
    this.mailer?.close();
    await this.fake?.stop();
  }

  get usesFakeServer(): boolean {
    return this.outbox !== undefined;
  }

  /** Sends one letter; a relay that refuses it is a 503 (the caller undoes its writes). */
  async send(letter: Letter): Promise<void> {
    try {
      await this.mailer!.send(composeLetter(letter));
    } catch (err) {
      // The error text may carry the recipient; log only its kind.
      this.logger.error(`Mail could not be sent (${(err as Error).name})`);
      throw new ServiceUnavailableException(
        'The e-mail could not be sent just now; nothing was saved. Please try again later',
      );
    }
  }
}
