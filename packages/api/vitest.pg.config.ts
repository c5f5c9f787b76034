import { defineConfig } from 'vitest/config';
import api from './vitest.config.js';

/**
 * The API tests again, on PostgreSQL (DATABASE_URL): a database per test app, copied from a
 * template seeded once (test/support/global-setup-pg.ts). Needs TEST_DATABASE_URL, from
 * `scripts/pg-cluster.sh start` (CI starts one); without it the project fails and says so.
 *
 * Left to the SQLite project, because what they test is SQLite's or the process's own and
 * PostgreSQL would only double their minutes: crash durability (WAL + synchronous=FULL under
 * kill -9), backup/restore (SQLite's online backup API; the PostgreSQL guidance of the CLIs needs
 * no database), a full or read-only data folder, the
 * SIGTERM shutdown, the two route fuzzers (the DTO validation they hammer runs before any
 * database, and they watch SQLite's data_version), and the unit specs beside the code.
 */
// Spread, not mergeConfig: that would append to the SQLite project's include and globalSetup.
export default defineConfig({
  ...api,
  test: {
    ...api.test,
    name: 'api-pg',
    include: ['test/**/*.test.ts'],
    exclude: [
      'test/crash-durability.test.ts',
      'test/backup.test.ts',
      'test/backup-postgres.test.ts',
      'test/storage-full.test.ts',
      'test/shutdown.test.ts',
      'test/fuzz-write-routes-*.test.ts',
    ],
    globalSetup: ['test/support/global-setup-pg.ts'],
  },
});
