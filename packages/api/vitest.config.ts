import { defineConfig } from 'vitest/config';

export default defineConfig({
  // Nest's injector reads design:paramtypes; without this metadata it silently injects undefined.
  oxc: { decorator: { legacy: true, emitDecoratorMetadata: true } },
  resolve: { conditions: ['workback-source'] },
  ssr: { resolve: { conditions: ['workback-source'] } },
  test: {
    name: 'api',
    include: ['src/**/*.spec.ts', 'test/**/*.test.ts'],
    // *.pg.test.ts need PostgreSQL (the api-pg project, vitest.pg.config.ts).
    exclude: ['test/**/*.pg.test.ts'],
    globalSetup: ['test/support/global-setup.ts'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 30_000,
    pool: 'forks',
  },
});
