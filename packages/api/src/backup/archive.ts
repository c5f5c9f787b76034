import { existsSync, linkSync, copyFileSync, mkdirSync, readdirSync, statSync } from 'node:fs';
import { mkdtemp, readdir, rm } from 'node:fs/promises';
import path from 'node:path';
import * as tar from 'tar';
import { backupDatabase, integrityCheck } from './sqlite-backup.js';

export const DATABASE_FILE = 'workback.sqlite';
export const PHOTOS_DIR = 'photos';

export interface BackupResult {
  file: string;
  photos: number;
  bytes: number;
}

/** The database (online backup) and the photo folder in one .tar.gz. Sessions are not kept. */
export async function createBackup(dataDir: string, out: string): Promise<BackupResult> {
  const staging = await mkdtemp(path.join(dataDir, '.backup-'));
  try {
    await backupDatabase(path.join(dataDir, DATABASE_FILE), path.join(staging, DATABASE_FILE));
    // Photos after the snapshot: every row in it had its file written before it committed.
    const photos = mirror(path.join(dataDir, PHOTOS_DIR), path.join(staging, PHOTOS_DIR));
    mkdirSync(path.dirname(path.resolve(out)), { recursive: true });
    await tar.c({ gzip: true, file: out, cwd: staging, portable: true }, await readdir(staging));
    return { file: path.resolve(out), photos, bytes: statSync(out).size };
  } finally {
    await rm(staging, { recursive: true, force: true });
  }
}

/** Unpacks a backup into an empty DATA_DIR and checks the database's integrity. */
export async function restoreBackup(file: string, dataDir: string): Promise<{ integrity: string }> {
  if (!existsSync(file)) throw new Error(`No backup file at ${file}`);
  mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  if (readdirSync(dataDir).length > 0) {
    throw new Error(`DATA_DIR ${dataDir} is not empty: restore only into an empty folder`);
  }
  await tar.x({ file, cwd: dataDir, strict: true, preservePaths: false });
  const integrity = await integrityCheck(path.join(dataDir, DATABASE_FILE));
  if (integrity !== 'ok') throw new Error(`The restored database failed its check: ${integrity}`);
  return { integrity };
}

/** Hard-links (or copies, across file systems) a folder tree; returns the file count. */
function mirror(from: string, to: string): number {
  if (!existsSync(from)) return 0;
  mkdirSync(to, { recursive: true });
  let count = 0;
  for (const entry of readdirSync(from, { withFileTypes: true })) {
    const src = path.join(from, entry.name);
    const dst = path.join(to, entry.name);
    if (entry.isDirectory()) count += mirror(src, dst);
    else if (entry.isFile()) {
      try {
        linkSync(src, dst);
      } catch {
        copyFileSync(src, dst);
      }
      count += 1;
    }
  }
  return count;
}
