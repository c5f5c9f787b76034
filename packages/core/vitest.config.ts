import { defineConfig } from 'vitest/config';

export default defineConfig({
  ssr: { resolve: { conditions: ['workback-source'] } },
  test: {
    name: 'core',
    include: ['src/**/*.test.ts'],
    environment: 'node',
  },
});
