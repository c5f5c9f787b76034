import { Injectable } from '@nestjs/common';
import argon2 from 'argon2';

// OWASP's minimum argon2id settings: 19 MiB, 2 passes, 1 lane.
const OPTIONS = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

@Injectable()
export class PasswordService {
  private dummyHash: Promise<string> | undefined;

  hash(password: string): Promise<string> {
    return argon2.hash(password, OPTIONS);
  }

  verify(hash: string, password: string): Promise<boolean> {
    return argon2.verify(hash, password);
  }

  /** Spends the same time as a real check, so an unknown e-mail is not told apart by timing. */
  async verifyNothing(password: string): Promise<false> {
    this.dummyHash ??= this.hash('workback-timing-equaliser');
    await argon2.verify(await this.dummyHash, password);
    return false;
  }
}
