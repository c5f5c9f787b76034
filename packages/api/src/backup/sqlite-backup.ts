import sqlite3 from 'sqlite3';

type Callback = (err: Error | null) => void;

// sqlite3 has Database#backup but its type declarations omit it.
interface OnlineBackup {
  step(pages: number, callback: Callback): void;
  finish(callback: Callback): void;
}
type BackupCapable = sqlite3.Database & {
  backup(destination: string, callback: Callback): OnlineBackup;
};

/**
 * Copies a live SQLite database with SQLite's online backup API: one step over
 * all pages under a read lock, so the copy is a consistent snapshot even while
 * the server keeps writing (WAL readers do not block writers).
 */
export function backupDatabase(source: string, destination: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(source, sqlite3.OPEN_READONLY, (openErr) => {
      if (openErr) return reject(openErr);
      db.run('PRAGMA busy_timeout = 10000');
      const backup = (db as BackupCapable).backup(destination, (startErr) => {
        if (startErr) return db.close(() => reject(startErr));
        backup.step(-1, (stepErr) => {
          if (stepErr) return backup.finish(() => db.close(() => reject(stepErr)));
          backup.finish((finishErr) => db.close(() => (finishErr ? reject(finishErr) : resolve())));
        });
      });
    });
  });
}

export function integrityCheck(file: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, sqlite3.OPEN_READONLY, (err) => {
      if (err) return reject(err);
      db.get<{ integrity_check: string }>('PRAGMA integrity_check', (qErr, row) =>
        db.close(() => (qErr ? reject(qErr) : resolve(row?.integrity_check ?? 'no answer'))),
      );
    });
  });
}
