import { HttpException, HttpStatus } from '@nestjs/common';

interface Slots {
  running: number;
  waiting: (() => void)[];
}

/**
 * At most `perKey` photo decodes at a time for one member; as many more wait their turn, and
 * beyond that the request is answered 429. In-process on purpose: it bounds this process's
 * memory and CPU, which is what decoding spends.
 */
export class DecodeSlots {
  private readonly slots = new Map<string, Slots>();

  constructor(private readonly perKey: number) {}

  async run<T>(key: string, work: () => Promise<T>): Promise<T> {
    await this.acquire(key);
    try {
      return await work();
    } finally {
      this.release(key);
    }
  }

  private acquire(key: string): Promise<void> {
    const slots = this.slots.get(key) ?? { running: 0, waiting: [] };
    this.slots.set(key, slots);
    if (slots.running < this.perKey) {
      slots.running++;
      return Promise.resolve();
    }
    if (slots.waiting.length >= this.perKey) {
      throw new HttpException(
        'Your earlier photos are still being prepared: please wait a moment, then send these again',
        HttpStatus.TOO_MANY_REQUESTS,
      );
    }
    return new Promise((resolve) => slots.waiting.push(resolve));
  }

  private release(key: string): void {
    const slots = this.slots.get(key)!;
    const next = slots.waiting.shift();
    if (next)
      next(); // the slot passes straight to the next in line
    else if (--slots.running === 0) this.slots.delete(key);
  }
}
