import type { ThrottlerStorage } from '@nestjs/throttler';
import { QueryTypes, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';

interface ThrottlerStorageRecord {
  totalHits: number;
  timeToExpire: number;
  isBlocked: boolean;
  timeToBlockExpire: number;
}

/**
 * The counts behind @nestjs/throttler (sign-in) and LimitsService (invitations, reset mails) in
 * PostgreSQL, so a limit counted by one process holds in every other. Same rules as the
 * in-memory store: each hit lives `ttl` ms (a sliding window); with a `blockDuration` the hit
 * past the limit blocks the key for that long, and the count starts again when it ends.
 * One key at a time, under an advisory lock, by the database's clock (tables: migration 0010).
 */
export class PostgresThrottlerStorage implements ThrottlerStorage {
  private calls = 0;

  constructor(private readonly sequelize: Sequelize) {}

  increment(
    key: string,
    ttl: number,
    limit: number,
    blockDuration: number,
    throttlerName: string,
  ): Promise<ThrottlerStorageRecord> {
    return this.sequelize.transaction((transaction) =>
      this.count(transaction, key, throttlerName, ttl, limit, blockDuration),
    );
  }

  private async count(
    transaction: Transaction,
    key: string,
    name: string,
    ttl: number,
    limit: number,
    blockDuration: number,
  ): Promise<ThrottlerStorageRecord> {
    const select = <T extends object>(sql: string, bind: unknown[] = []) =>
      this.sequelize.query<T>(sql, { bind, transaction, type: QueryTypes.SELECT });
    const run = (sql: string, bind: unknown[]) => this.sequelize.query(sql, { bind, transaction });

    await select('SELECT pg_advisory_xact_lock(hashtext($1))', [`${name}|${key}`]);
    const [clock] = await select<{ now: string }>(
      'SELECT (extract(epoch FROM clock_timestamp()) * 1000)::bigint AS now',
    );
    const now = Number(clock!.now);
    if (++this.calls % 200 === 0) {
      await run('DELETE FROM limit_hits WHERE expires_at <= $1', [now]);
      await run('DELETE FROM limit_blocks WHERE until <= $1', [now]);
    }
    await run('DELETE FROM limit_hits WHERE key = $1 AND name = $2 AND expires_at <= $3', [
      key,
      name,
      now,
    ]);
    const [block] = await select<{ until: string }>(
      'SELECT until FROM limit_blocks WHERE key = $1 AND name = $2',
      [key, name],
    );
    let blockedUntil = block ? Number(block.until) : 0;
    if (blockedUntil && blockedUntil <= now) {
      // The block is over: the count starts again.
      await run('DELETE FROM limit_blocks WHERE key = $1 AND name = $2', [key, name]);
      await run('DELETE FROM limit_hits WHERE key = $1 AND name = $2', [key, name]);
      blockedUntil = 0;
    }
    const hitsNow = async () => {
      const [row] = await select<{ n: number; first: string | null }>(
        'SELECT COUNT(*)::int AS n, MIN(expires_at) AS first FROM limit_hits WHERE key = $1 AND name = $2',
        [key, name],
      );
      return { n: row!.n, first: row!.first === null ? now + ttl : Number(row!.first) };
    };
    const hit = () =>
      run('INSERT INTO limit_hits (key, name, expires_at) VALUES ($1, $2, $3)', [
        key,
        name,
        now + ttl,
      ]);
    const seconds = (ms: number) => Math.max(0, Math.ceil(ms / 1000));

    let hits = await hitsNow();
    if (blockDuration <= 0) {
      const isBlocked = hits.n >= limit;
      if (!isBlocked) {
        await hit();
        hits = await hitsNow();
      }
      return {
        totalHits: hits.n + (isBlocked ? 1 : 0),
        timeToExpire: seconds(hits.first - now),
        isBlocked,
        timeToBlockExpire: isBlocked ? seconds(hits.first - now) : 0,
      };
    }
    if (!blockedUntil) {
      await hit();
      hits = await hitsNow();
      if (hits.n > limit) {
        blockedUntil = now + blockDuration;
        await run(
          `INSERT INTO limit_blocks (key, name, until) VALUES ($1, $2, $3)
           ON CONFLICT (key, name) DO UPDATE SET until = EXCLUDED.until`,
          [key, name, blockedUntil],
        );
      }
    }
    return {
      totalHits: hits.n,
      timeToExpire: seconds(hits.first - now),
      isBlocked: blockedUntil > 0,
      timeToBlockExpire: blockedUntil > 0 ? seconds(blockedUntil - now) : 0,
    };
  }
}
