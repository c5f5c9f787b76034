import { randomUUID } from 'node:crypto';
import { Injectable, type OnModuleDestroy } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { InjectConnection } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { AppConfig } from '../config/app.config.js';
import { transactionOf, WRITE_HOOKS } from '../database/model-writes.js';
import { PgChannel } from '../database/pg-channel.js';
import { Miss } from './models/miss.model.js';

/**
 * How many misses a notebook filter matches, kept for `ttlMs` per household: counting a big
 * notebook is the costliest part of paging through it, and the number only moves when a miss
 * of that household is written. Writes through the Miss model forget the household's counts
 * (again when their transaction commits); anything written past the model shows within ttlMs.
 *
 * On PostgreSQL several processes share the database: each such write also posts the household
 * on the `workback_counts` channel (LISTEN/NOTIFY, sent when the write commits), and every
 * process forgets that household's counts when it hears it. While a process is not listening
 * (its listening connection lost) it keeps no counts.
 */
@Injectable()
export class CountCache implements OnModuleDestroy {
  static readonly TTL_MS = 10_000;
  private readonly counts = new Map<number, Map<string, { at: number; value: Promise<number> }>>();
  private readonly hookName = `count-cache-${randomUUID()}`;
  private readonly channel: PgChannel | undefined;

  // The connection is injected so the model is registered with it before hooks are added.
  constructor(@InjectConnection() sequelize: Sequelize, config: ConfigService) {
    const url = config.getOrThrow<AppConfig>('app').databaseUrl;
    this.channel = url
      ? new PgChannel(url, 'workback_counts', (household) => this.forget(household))
      : undefined;
    const onWrite = async (...args: unknown[]) => {
      const row = args[0] instanceof Miss ? args[0] : undefined;
      const household = row ? String(row.householdId) : '';
      this.forget(household);
      const transaction = transactionOf(args);
      transaction?.afterCommit(() => this.forget(household));
      // Awaited by the write, so the notice is out before the request answers.
      await this.channel?.send(sequelize, household, transaction);
    };
    for (const hook of WRITE_HOOKS) Miss.addHook(hook, this.hookName, onWrite);
  }

  /** One household's counts ('12'), or everyone's ('' or null). */
  private forget(household: string | null): void {
    if (household) this.counts.delete(Number(household));
    else this.counts.clear();
  }

  count(householdId: number, key: string, load: () => Promise<number>): Promise<number> {
    if (this.channel && !this.channel.listening) return load();
    const now = Date.now();
    let household = this.counts.get(householdId);
    if (!household) this.counts.set(householdId, (household = new Map()));
    const hit = household.get(key);
    if (hit && now - hit.at < CountCache.TTL_MS) return hit.value;
    if (household.size > 200) household.clear();
    const value = load();
    const entry = { at: now, value };
    household.set(key, entry);
    value.catch(() => {
      if (household.get(key) === entry) household.delete(key);
    });
    return value;
  }

  async onModuleDestroy(): Promise<void> {
    for (const hook of WRITE_HOOKS) Miss.removeHook(hook, this.hookName);
    await this.channel?.close();
  }
}
