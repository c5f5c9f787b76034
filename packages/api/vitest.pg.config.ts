import { defineConfig } from 'vitest/config';
import api from './vitest.config.js';

/**
 * The API tests again, on PostgreSQL (DATABASE_URL): a database per test app, copied from a
 * template seeded once (test/support/global-setup-pg.ts). Needs TEST_DATABASE_URL, from
 * `scripts/pg-cluster.sh start` (CI starts one); without it the project fails and says so.
 *
 * Left to the SQLite project, so the second database does not double CI's minutes:
 * - what is SQLite's own: crash durability (WAL + synchronous=FULL under kill -9), backup and
 *   restore (SQLite's online backup API), a full or read-only data folder, the route fuzzers
 *   (they watch SQLite's data_version; the DTO validation they hammer runs before any query);
 * - what runs no query of its own, the same on either database: the SIGTERM shutdown and
 *   production start (server processes), security headers, web delivery, password rules, mail
 *   and mailed links, the engine's diagnose route, PDF printing, the CLIs' PostgreSQL guidance,
 *   and the route-by-role access matrix (the guards decide before any query; each area's own
 *   tests check household scoping and 404s on PostgreSQL too);
 * - the unit specs beside the code.
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
      'test/storage-full.test.ts',
      'test/fuzz-write-routes-*.test.ts',
      'test/shutdown.test.ts',
      'test/production-start.test.ts',
      'test/security-headers.test.ts',
      'test/web-delivery.test.ts',
      'test/passwords.test.ts',
      'test/mail.test.ts',
      'test/mail-links.test.ts',
      'test/diagnose.test.ts',
      'test/review-plan-print.test.ts',
      'test/backup-postgres.test.ts',
      'test/access-matrix.test.ts',
    ],
    globalSetup: ['test/support/global-setup-pg.ts'],
    setupFiles: ['test/support/pg-one-query-at-a-time.ts'],
  },
});
