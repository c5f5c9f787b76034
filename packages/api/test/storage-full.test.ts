import path from 'node:path';
import { getConnectionToken } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import sqlite3 from 'sqlite3';
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
    const admin = await signedIn(t, DEMO.admin);
    const metrics = (await admin.get('/api/admin/metrics').expect(200)).body;
    expect(metrics.storageFaults).toBeGreaterThanOrEqual(1);
    expect(metrics.sqliteBusy).toBe(0);
  });
});

describe('a database held by another writer', () => {
  function run(db: sqlite3.Database, sql: string): Promise<void> {
    return new Promise((resolve, reject) => db.exec(sql, (err) => (err ? reject(err) : resolve())));
  }

  it('answers 503 when the wait runs out, saves nothing, and counts it for the site admin', async () => {
    const owner = await signedIn(t, DEMO.owner);
    const admin = await signedIn(t, DEMO.admin);
    const sequelize = t.app.get<Sequelize>(getConnectionToken());
    const busyBefore = (await admin.get('/api/admin/metrics').expect(200)).body.sqliteBusy;
    const before = (await owner.get('/api/students').expect(200)).body.total as number;
    // A short wait on the app's shared connection, so the test need not sit out the 10 s one.
    await sequelize.query('PRAGMA busy_timeout = 100');
    const other = new sqlite3.Database(path.join(t.dataDir, 'workback.sqlite'));
    try {
      await run(other, 'BEGIN IMMEDIATE');
      const res = await owner.post('/api/students', { name: 'Waits', gradeLevel: '2' });
      expect(res.status).toBe(503);
      expect(res.body.message).toMatch(/busy with other changes, so nothing was saved/);
      // Worth trying again shortly: the other writer will be done.
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      await run(other, 'ROLLBACK');
    } finally {
      await new Promise((resolve) => other.close(resolve));
      await sequelize.query('PRAGMA busy_timeout = 10000');
    }
    expect((await owner.get('/api/students').expect(200)).body.total).toBe(before);
    const metrics = (await admin.get('/api/admin/metrics').expect(200)).body;
    expect(metrics.sqliteBusy).toBe(busyBefore + 1);
    expect(metrics.requests['5xx']).toBeGreaterThanOrEqual(1);
    expect(metrics.memory.peakRssBytes).toBeGreaterThanOrEqual(metrics.memory.rssBytes);
  });
});
