import react from '@vitejs/plugin-react';
import filterRules from 'postcss-filter-rules';
import { defaultClientConditions, defineConfig } from 'vite';
import { compression } from 'vite-plugin-compression2';
import { VitePWA } from 'vite-plugin-pwa';

import { pwaOptions } from './pwa.config';

export default defineConfig({
  plugins: [
    react(),
    VitePWA(pwaOptions),
    // Brotli and gzip copies beside each file; the server sends the one the browser accepts.
    compression({ algorithms: ['brotliCompress', 'gzip'] }),
  ],
  resolve: {
    // Use @workback/core's TypeScript source directly, so dev and build need no core build first.
    conditions: ['workback-source', ...defaultClientConditions],
  },
  css: {
    postcss: {
      // Workback has no dark theme: Blueprint's dark rules are a fifth of its stylesheet.
      plugins: [filterRules({ filter: (_selector, parts) => !parts.includes('.bp6-dark') })],
    },
  },
  server: {
    proxy: {
      '/api': 'http://localhost:3000',
    },
  },
  build: {
    // The API serves this folder under a strict CSP: no inline scripts, so keep modules external.
    modulePreload: { polyfill: false },
    // dist/.vite/manifest.json: the service worker keeps the offline pages' files (pwa.config.ts).
    // A dot-folder, which the server's static files never serve.
    manifest: true,
    chunkSizeWarningLimit: 1200,
    rolldownOptions: {
      output: {
        // On a slow connection each file costs a round trip, and a browser opens only six
        // connections to a server over http/1.1: the first page waited on a queue of twenty
        // small files more than on their bytes. Everything the entry imports goes in one file.
        codeSplitting: { groups: [{ name: 'app', tags: ['$initial'] }] },
      },
    },
  },
});
