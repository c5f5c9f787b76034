import type { VitePWAOptions } from 'vite-plugin-pwa';

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
    // Kept at install: the page itself and the icons. The code and styles a page uses are kept
    // as it uses them (below), so installing downloads nothing more on a slow connection.
    globPatterns: ['index.html', 'icons/*.png'],
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
