import path from 'node:path';
import { parseArgs } from 'node:util';
import { restoreBackup } from '../backup/archive.js';
import { postgresGuidance } from '../backup/postgres-guidance.js';
import { validateEnv } from '../config/env.validation.js';

// npm run restore -- FILE   (into an empty DATA_DIR, with the server stopped)
const { positionals } = parseArgs({ allowPositionals: true });
const env = validateEnv(process.env);
if (env.DATABASE_URL) {
  console.error(postgresGuidance(env, 'restore'));
  process.exit(2);
}
const file = positionals[0];
if (!file) {
  console.error('Usage: npm run restore -- FILE');
  process.exit(2);
}
const dataDir = path.resolve(env.DATA_DIR);

restoreBackup(path.resolve(file), dataDir).then(
  () => console.log(`Restored ${file} into ${dataDir}; the database passed its integrity check`),
  (err: unknown) => {
    console.error(`Restore failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(2);
  },
);
