import react from '@vitejs/plugin-react';
import { defaultClientConditions, defineConfig } from 'vite';
import { VitePWA } from 'vite-plugin-pwa';

import { pwaOptions } from './pwa.config';

export default defineConfig({
  plugins: [react(), VitePWA(pwaOptions)],
  resolve: {
    // Use @workback/core's TypeScript source directly, so dev and build need no core build first.
    conditions: ['workback-source', ...defaultClientConditions],
  },
  server: {
    proxy: {
      '/api': 'http://localhost:3000',
    },
  },
  build: {
    // The API serves this folder under a strict CSP: no inline scripts, so keep modules external.
    modulePreload: { polyfill: false },
    chunkSizeWarningLimit: 1200,
  },
});
