import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    demoTemplateDir: string;
  }
}

/**
 * Seeds the demo household once per run into a template DATA_DIR; each test app starts
 * from a copy of it instead of re-running the seed (seconds per boot on 2 cores).
 */
export default async function setup(project: TestProject) {
  const dir = mkdtempSync(path.join(tmpdir(), 'workback-template-'));
  Object.assign(process.env, {
    NODE_ENV: 'test',
    DATA_DIR: dir,
    SEED_DEMO: 'true',
    ADMIN_EMAILS: '',
  });
  const { createApp } = await import('../../src/app.factory.js');
  const { app } = await createApp();
  await app.close();
  project.provide('demoTemplateDir', dir);
  return () => rmSync(dir, { recursive: true, force: true });
}
