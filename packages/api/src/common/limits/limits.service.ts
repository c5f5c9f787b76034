import { HttpException, HttpStatus, Inject, Injectable } from '@nestjs/common';
import { ThrottlerStorage } from '@nestjs/throttler';

/** One named limit: at most `limit` counted events per `windowMs`, sliding. */
export interface LimitRule {
  name: string;
  limit: number;
  windowMs: number;
  /** The plain sentence a refused person reads (429). */
  message: string;
}

/**
 * Counts events that anyone can make the server do (invitations, reset mails) in the one store
 * the sign-in throttler also uses: the `ThrottlerStorage` that ThrottlerModule provides
 * (in-process today; a store shared across processes is its `storage` option in app.module.ts).
 */
@Injectable()
export class LimitsService {
  constructor(@Inject(ThrottlerStorage) private readonly store: ThrottlerStorage) {}

  /** Counts one event for `key`, or answers 429 with the rule's message once it is used up. */
  async take(rule: LimitRule, key: string): Promise<void> {
    const { isBlocked } = await this.store.increment(
      `limit:${rule.name}:${key}`,
      rule.windowMs,
      rule.limit,
      0,
      rule.name,
    );
    if (isBlocked) throw new HttpException(rule.message, HttpStatus.TOO_MANY_REQUESTS);
  }
}
