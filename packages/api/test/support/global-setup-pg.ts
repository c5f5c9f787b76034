import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { createDatabase, databaseUrl, dropDatabase, newDatabaseName, serverUrl } from './pg.js';

declare module 'vitest' {
  export interface ProvidedContext {
    pgServerUrl: string;
    pgTemplate: string;
  }
}

/**
 * As global-setup.ts, on PostgreSQL: the demo household is seeded once into a template
 * database (and a template DATA_DIR for its photo files); each test app copies both.
 * Without TEST_DATABASE_URL the project fails at once, saying how to start a cluster.
 */
export default async function setup(project: TestProject) {
  const server = serverUrl();
  const template = newDatabaseName('workback_template');
  await createDatabase(server, template);
  const dir = mkdtempSync(path.join(tmpdir(), 'workback-template-pg-'));
  Object.assign(process.env, {
    NODE_ENV: 'test',
    DATA_DIR: dir,
    DATABASE_URL: databaseUrl(server, template),
    SEED_DEMO: 'true',
    ADMIN_EMAILS: '',
  });
  const { createApp } = await import('../../src/app.factory.js');
  const { app } = await createApp();
  await app.close();
  project.provide('demoTemplateDir', dir);
  project.provide('pgServerUrl', server);
  project.provide('pgTemplate', template);
  return async () => {
    rmSync(dir, { recursive: true, force: true });
    await dropDatabase(server, template);
  };
}
