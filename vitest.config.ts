import { defineConfig } from 'vitest/config';

// One runner for the whole repository; each package keeps its own project config.
export default defineConfig({
  test: {
    projects: ['packages/core', 'packages/api', 'packages/web', 'packages/web/e2e'],
  },
});
