import react from '@vitejs/plugin-react';
import { defaultClientConditions, defaultServerConditions } from 'vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  plugins: [react()],
  resolve: { conditions: ['workback-source', ...defaultClientConditions] },
  ssr: { resolve: { conditions: ['workback-source', ...defaultServerConditions] } },
  test: {
    name: 'web',
    include: ['src/**/*.test.{ts,tsx}'],
    environment: 'happy-dom',
    // A laptop-sized window; phone tests narrow it themselves.
    environmentOptions: { happyDOM: { width: 1280, height: 900 } },
    setupFiles: ['./src/testing/setup.ts'],
    css: false,
    testTimeout: 20_000,
    restoreMocks: true,
    unstubGlobals: true,
  },
});
