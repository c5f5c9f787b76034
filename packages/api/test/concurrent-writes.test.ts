import { getConnectionToken } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, onPostgres, signedIn, startTestApp, type TestApp } from './support/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
}, 120_000);
afterAll(() => t.close());

describe('many writes at once', () => {
  it('saves every one of 60 misses sent together, with no SQLITE_BUSY', async () => {
    const owner = await signedIn(t, DEMO.owner);
    const admin = await signedIn(t, DEMO.admin);
    const student = (await owner.get('/api/students').expect(200)).body.items[0].id as number;
    const before = (await owner.get('/api/misses').expect(200)).body.total as number;
    // More waiting writers than libuv has worker threads (4), which used to starve the one
    // holding the lock until the others gave up after busy_timeout.
    const answers = await Promise.all(
      Array.from({ length: 60 }, (_, i) =>
        owner.post('/api/misses', {
          studentId: student,
          occurredOn: '2026-03-02',
          problem: `${300 + i} - 75`,
          answer: '139',
          explanation: `together ${i}`,
          cause: 'step',
        }),
      ),
    );
    expect(answers.map((a) => a.status)).toEqual(answers.map(() => 201));
    expect((await owner.get('/api/misses').expect(200)).body.total).toBe(before + 60);
    expect((await admin.get('/api/admin/metrics').expect(200)).body.sqliteBusy).toBe(0);
  });

  it('never waits for ever on a transaction opened inside another (SQLite refuses it)', async () => {
    const sequelize = t.app.get<Sequelize>(getConnectionToken());
    if (onPostgres()) {
      // No in-process queue on PostgreSQL: the inner one is a second transaction beside it.
      await expect(
        sequelize.transaction(async () => sequelize.transaction(async () => 1)),
      ).resolves.toBe(1);
      return;
    }
    await expect(
      sequelize.transaction(async () => sequelize.transaction(async () => 1)),
    ).rejects.toThrow(/opened inside another/);
    // The queue goes on after the refusal.
    await expect(sequelize.transaction(async () => 2)).resolves.toBe(2);
  });
});
