import { HttpException } from '@nestjs/common';
import { describe, expect, it } from 'vitest';
import { DecodeSlots } from './decode-slots.js';

function gate() {
  let open!: () => void;
  const opened = new Promise<void>((resolve) => (open = resolve));
  return { open, opened };
}

describe('DecodeSlots', () => {
  it('runs two at a time per member, queues two more, and refuses the next with 429', async () => {
    const slots = new DecodeSlots(2);
    const started: number[] = [];
    const gates = [gate(), gate(), gate(), gate()];
    const runs = gates.map((g, i) =>
      slots.run('member-1', async () => {
        started.push(i);
        await g.opened;
        return i;
      }),
    );
    await Promise.resolve();
    expect(started).toEqual([0, 1]);

    const refused = await slots.run('member-1', async () => 'never').catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(HttpException);
    expect((refused as HttpException).getStatus()).toBe(429);

    // Another member is not held up by the first one's queue.
    expect(await slots.run('member-2', async () => 'other')).toBe('other');

    gates[0]!.open();
    await runs[0];
    await new Promise((r) => setImmediate(r));
    expect(started).toEqual([0, 1, 2]);
    for (const g of gates) g.open();
    expect(await Promise.all(runs)).toEqual([0, 1, 2, 3]);
    // Everything released: a fresh burst gets its two slots again.
    expect(await slots.run('member-1', async () => 'again')).toBe('again');
  });

  it('frees the slot when the work fails', async () => {
    const slots = new DecodeSlots(1);
    await expect(slots.run('m', () => Promise.reject(new Error('bad photo')))).rejects.toThrow(
      'bad photo',
    );
    expect(await slots.run('m', async () => 'next')).toBe('next');
  });
});
