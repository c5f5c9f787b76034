import { defineConfig } from 'vitest/config';

// One runner for the whole repository; each package keeps its own project config.
export default defineConfig({
  test: {
    projects: [
      'packages/core',
      'packages/api',
      'packages/api/vitest.pg.config.ts',
      'packages/web',
      'packages/web/e2e',
    ],
    // Vitest's default in run mode is one worker fewer than the CPUs: a single worker on CI's
    // two cores, which left one core idle for the whole suite.
    maxWorkers: 2,
  },
});
