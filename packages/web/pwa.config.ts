import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

import type { VitePWAOptions } from 'vite-plugin-pwa';

/**
 * The pages a parent needs with no connection: the notebook (what waits to send) and the log
 * form. Their build files are kept when the worker installs, so they open offline even on a
 * phone that never opened them online.
 */
const OFFLINE_ROUTES = ['src/app/routes/notebook.tsx', 'src/app/routes/log-miss.tsx'];

/** Loaded later by those pages, but not needed offline: the wide screen's table. */
const ONLINE_ONLY = ['index.html', 'src/features/misses/components/notebook-table.tsx'];

type ViteManifest = Record<
  string,
  {
    file: string;
    imports?: string[];
    dynamicImports?: string[];
    css?: string[];
    assets?: string[];
  }
>;

/**
 * The build files of `OFFLINE_ROUTES` and all they import, at once or on use (the photo cropper,
 * the photo preparer and its worker script), read from Vite's build manifest.
 */
function offlineFiles(): Set<string> {
  const path = join(import.meta.dirname, 'dist/.vite/manifest.json');
  if (!existsSync(path)) return new Set();
  const manifest = JSON.parse(readFileSync(path, 'utf8')) as ViteManifest;
  const files = new Set<string>();
  const seen = new Set<string>();
  const visit = (key: string) => {
    const chunk = manifest[key];
    if (!chunk || seen.has(key)) return;
    seen.add(key);
    files.add(chunk.file);
    for (const css of chunk.css ?? []) files.add(css);
    // Files a chunk names by URL, such as the photo preparer's worker script (`?url`).
    for (const asset of chunk.assets ?? []) files.add(asset);
    for (const imported of chunk.imports ?? []) visit(imported);
    if (key === 'index.html') return;
    for (const later of chunk.dynamicImports ?? []) if (!ONLINE_ONLY.includes(later)) visit(later);
  };
  OFFLINE_ROUTES.forEach(visit);
  return files;
}

/**
 * The installable app: a web app manifest with our own icons (scripts/make-icons.mjs), and a
 * service worker (Workbox, generated at build) that keeps the app's own files so it opens
 * without a connection. It never answers for /api: data and photos always come from the server,
 * and a request made offline fails as it would without it. Registered from src/lib/service-worker.ts
 * after the page has loaded, so it does not compete with the first open.
 */
export const pwaOptions: Partial<VitePWAOptions> = {
  registerType: 'autoUpdate',
  // Registered by our own module: an injected inline script would break the strict CSP.
  injectRegister: false,
  includeAssets: ['icons/apple-touch-icon.png'],
  manifest: {
    id: '/',
    name: 'Workback',
    short_name: 'Workback',
    description: 'A notebook for the math problems your child missed.',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    background_color: '#fbf8f1',
    theme_color: '#fbf8f1',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
      {
        src: '/icons/icon-maskable-512.png',
        sizes: '512x512',
        type: 'image/png',
        purpose: 'maskable',
      },
    ],
  },
  workbox: {
    // Kept at install: the page itself, the icons, and the build files of the pages that work
    // offline (the first open has loaded most of them already: the worker installs after it).
    // The code and styles of other pages are kept as they are used (below).
    globPatterns: ['index.html', 'icons/*.png', 'assets/*.{js,css}'],
    // Build files are named by their content: kept as they are, so the worker takes the ones the
    // first open loaded from the browser's cache instead of downloading them again.
    dontCacheBustURLsMatching: /^assets\//,
    manifestTransforms: [
      (entries) => {
        const offline = offlineFiles();
        return {
          manifest: entries.filter((e) => !e.url.startsWith('assets/') || offline.has(e.url)),
          warnings: offline.size === 0 ? ['no build manifest: offline pages not precached'] : [],
        };
      },
    ],
    navigateFallback: 'index.html',
    navigateFallbackDenylist: [/^\/api(\/|$)/],
    runtimeCaching: [
      {
        // Hashed build files never change: served from the phone once kept.
        // Nothing else is cached at run time: /api answers (JSON, photos, PDFs) always go to
        // the network.
        urlPattern: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith('/assets/'),
        handler: 'CacheFirst',
        options: {
          cacheName: 'workback-assets',
          expiration: { maxEntries: 400, maxAgeSeconds: 90 * 24 * 60 * 60 },
          cacheableResponse: { statuses: [200] },
        },
      },
    ],
    inlineWorkboxRuntime: true,
    cleanupOutdatedCaches: true,
    clientsClaim: true,
    skipWaiting: true,
  },
};
