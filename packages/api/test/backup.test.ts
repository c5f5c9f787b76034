import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sqlite3 from 'sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createBackup, restoreBackup } from '../src/backup/archive.js';
import { DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

let t: TestApp;
const scratch = mkdtempSync(path.join(tmpdir(), 'workback-backup-'));

beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
  rmSync(scratch, { recursive: true, force: true });
});

function names(file: string): Promise<string[]> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, sqlite3.OPEN_READONLY);
    db.all<{ name: string }>('SELECT name FROM students ORDER BY id', (err, rows) =>
      db.close(() => (err ? reject(err) : resolve(rows.map((r) => r.name)))),
    );
  });
}

describe('backup and restore', () => {
  it('takes a consistent copy while writes are running and restores it into an empty folder', async () => {
    const owner = await signedIn(t, DEMO.owner);
    let writing = true;
    let written = 0;
    const writer = (async () => {
      while (writing) {
        await owner
          .post('/api/students', { name: `Writer ${written}`, gradeLevel: '3' })
          .expect(201);
        written += 1;
      }
    })();
    // Writes land before and after the copy, however slowly a loaded machine answers them.
    const until = async (done: () => boolean) => {
      while (!done()) await new Promise((r) => setTimeout(r, 20));
    };
    await until(() => written >= 2);
    const archive = path.join(scratch, 'backup.tar.gz');
    const result = await createBackup(t.dataDir, archive);
    const atCopy = written;
    await until(() => written >= atCopy + 2);
    writing = false;
    await writer;
    expect(result.bytes).toBeGreaterThan(0);

    const target = path.join(scratch, 'restored');
    await expect(restoreBackup(archive, target)).resolves.toEqual({ integrity: 'ok' });
    const restored = await names(path.join(target, 'workback.sqlite'));
    const live = await names(path.join(t.dataDir, 'workback.sqlite'));
    // The snapshot is a prefix of the live table: nothing torn, nothing invented.
    expect(restored.length).toBeGreaterThan(2);
    expect(restored.length).toBeLessThan(live.length);
    expect(live.slice(0, restored.length)).toEqual(restored);
    expect(written).toBeGreaterThan(0);
  });

  it('refuses to restore into a folder that is not empty', async () => {
    const archive = path.join(scratch, 'again.tar.gz');
    await createBackup(t.dataDir, archive);
    await expect(restoreBackup(archive, t.dataDir)).rejects.toThrow(/not empty/);
  });
});
