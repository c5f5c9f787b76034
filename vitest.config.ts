import { defineConfig } from 'vitest/config';

// One runner for the whole repository; each package keeps its own project config.
export default defineConfig({
  test: {
    projects: ['packages/core', 'packages/api', 'packages/web', 'packages/web/e2e'],
    // Vitest leaves one core free by default; on a 2-core CI machine that means one worker,
    // and the long API files (fuzzing, crash test) would run strictly one after another.
    maxWorkers: 2,
  },
});
