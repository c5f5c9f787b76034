import { Logger } from '@nestjs/common';
import pg from 'pg';
import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';

/**
 * One PostgreSQL LISTEN/NOTIFY channel between the processes that share a database: `send`
 * posts a notice (inside the writer's transaction it goes out only if and when that commits),
 * and every process's `onNotice` hears it, its own included. The listening connection is its
 * own; while it is down (and until it is back) `listening` is false, so a cache that relies on
 * the notices keeps nothing meanwhile, and it hears `onNotice(null)` once back ("forget all":
 * notices may have been missed).
 */
export class PgChannel {
  private readonly logger = new Logger('PgChannel');
  private client: pg.Client | undefined;
  private closed = false;
  private retry: NodeJS.Timeout | undefined;
  listening = false;

  constructor(
    private readonly url: string,
    readonly name: string,
    private readonly onNotice: (payload: string | null) => void,
  ) {
    if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`not a channel name: ${name}`);
    void this.connect();
  }

  /** Posts `payload` to every process (PostgreSQL caps a payload at 8,000 bytes). */
  async send(sequelize: Sequelize, payload: string, transaction?: Transaction | null) {
    await sequelize.query('SELECT pg_notify(:channel, :payload)', {
      replacements: { channel: this.name, payload },
      transaction: transaction ?? undefined,
    });
  }

  async close(): Promise<void> {
    this.closed = true;
    clearTimeout(this.retry);
    this.listening = false;
    await this.client?.end().catch(() => undefined);
  }

  private async connect(): Promise<void> {
    const client = new pg.Client({ connectionString: this.url });
    this.client = client;
    const lost = (e?: Error) => {
      if (this.client !== client) return;
      this.listening = false;
      this.client = undefined;
      client.removeAllListeners('notification');
      void client.end().catch(() => undefined);
      if (this.closed) return;
      if (e) this.logger.warn(`the ${this.name} notices stopped: ${e.message}; trying again`);
      this.retry = setTimeout(() => void this.connect(), 1_000);
    };
    client.on('error', lost);
    client.on('end', () => lost());
    client.on('notification', (n) => this.onNotice(n.payload ?? ''));
    try {
      await client.connect();
      await client.query(`LISTEN ${this.name}`);
      if (this.closed) return void (await client.end());
      this.listening = true;
      this.onNotice(null);
    } catch (e) {
      lost(e as Error);
    }
  }
}
