import { randomUUID } from 'node:crypto';
import { Injectable, type OnModuleDestroy } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { Miss } from './models/miss.model.js';

const HOOKS = [
  'afterCreate',
  'afterUpdate',
  'afterDestroy',
  'afterBulkCreate',
  'afterBulkUpdate',
  'afterBulkDestroy',
] as const;

/**
 * How many misses a notebook filter matches, kept for `ttlMs` per household: counting a big
 * notebook is the costliest part of paging through it, and the number only moves when a miss
 * of that household is written. Writes through the Miss model forget the household's counts
 * (again when their transaction commits); anything written past the model shows within ttlMs.
 */
@Injectable()
export class CountCache implements OnModuleDestroy {
  static readonly TTL_MS = 10_000;
  private readonly counts = new Map<number, Map<string, { at: number; value: Promise<number> }>>();
  private readonly hookName = `count-cache-${randomUUID()}`;

  // The connection is injected so the model is registered with it before hooks are added.
  constructor(@InjectConnection() _sequelize: Sequelize) {
    const onWrite = (...args: unknown[]) => {
      const row = args[0] instanceof Miss ? args[0] : undefined;
      const forget = () => {
        if (row) this.counts.delete(row.householdId);
        else this.counts.clear();
      };
      forget();
      const options = args.find(
        (a): a is { transaction?: Transaction | null } =>
          typeof a === 'object' && a !== null && 'transaction' in a,
      );
      options?.transaction?.afterCommit(forget);
    };
    for (const hook of HOOKS) Miss.addHook(hook, this.hookName, onWrite);
  }

  count(householdId: number, key: string, load: () => Promise<number>): Promise<number> {
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

  onModuleDestroy(): void {
    for (const hook of HOOKS) Miss.removeHook(hook, this.hookName);
  }
}
