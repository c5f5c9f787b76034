import { getConnectionToken } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
}, 120_000);
afterAll(() => t.close());

describe('a full disk', () => {
  it('answers 507 with a plain message and leaves the database as it was', async () => {
    const owner = await signedIn(t, DEMO.owner);
    const sequelize = t.app.get<Sequelize>(getConnectionToken());
    // SQLite's own cap on the file size stands in for a full disk (root ignores file modes).
    const [[{ page_count }]] = (await sequelize.query('PRAGMA page_count')) as [
      [{ page_count: number }],
      unknown,
    ];
    await sequelize.query(`PRAGMA max_page_count = ${page_count}`);
    try {
      let refused: { status: number; body: { message: string } } | undefined;
      for (let i = 0; i < 500 && !refused; i += 1) {
        const before = (await owner.get('/api/students').expect(200)).body.total as number;
        const res = await owner.post('/api/students', {
          name: `Filler ${i} ${'x'.repeat(30)}`,
          gradeLevel: '2',
        });
        if (res.status !== 201) {
          refused = res;
          const after = (await owner.get('/api/students').expect(200)).body.total as number;
          expect(after).toBe(before);
        }
      }
      expect(refused?.status).toBe(507);
      expect(refused?.body.message).toMatch(/out of storage space, so nothing was saved/);
    } finally {
      await sequelize.query('PRAGMA max_page_count = 1073741823');
    }
    await owner.post('/api/students', { name: 'After', gradeLevel: '2' }).expect(201);
  });
});
