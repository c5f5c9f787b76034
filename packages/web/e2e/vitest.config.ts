import { defineConfig } from 'vitest/config';

// Browser journeys against the real, built server (API + web app on one port). Run from the root:
// `npm run build && npx vitest run --project e2e`.
export default defineConfig({
  test: {
    name: 'e2e',
    root: import.meta.dirname,
    include: ['**/*.e2e.test.ts'],
    environment: 'node',
    globalSetup: ['./global-setup.ts'],
    fileParallelism: false,
    testTimeout: 90_000,
    hookTimeout: 120_000,
  },
});
