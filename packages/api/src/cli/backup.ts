import path from 'node:path';
import { parseArgs } from 'node:util';
import { createBackup } from '../backup/archive.js';
import { postgresGuidance } from '../backup/postgres-guidance.js';
import { validateEnv } from '../config/env.validation.js';

// npm run backup -- --out FILE   (safe while the server runs)
const { values } = parseArgs({ options: { out: { type: 'string' } } });
const env = validateEnv(process.env);
if (env.DATABASE_URL) {
  console.error(postgresGuidance(env, 'backup'));
  process.exit(2);
}
const dataDir = path.resolve(env.DATA_DIR);
const out = values.out ?? `workback-backup-${new Date().toISOString().slice(0, 10)}.tar.gz`;

createBackup(dataDir, out).then(
  (r) =>
    console.log(`Backed up ${dataDir} to ${r.file} (${r.photos} photo files, ${r.bytes} bytes)`),
  (err: unknown) => {
    console.error(`Backup failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(2);
  },
);
