import { Workbox } from 'workbox-window';

const ASSETS = `${location.origin}/assets/`;

/** The build files this page has loaded so far (hashed, under /assets/). */
function loadedAssets(): string[] {
  return performance
    .getEntriesByType('resource')
    .map((entry) => entry.name)
    .filter((name) => name.startsWith(ASSETS));
}

/**
 * Registers the service worker that keeps the app's files for offline use and installing to a
 * home screen. Only in a production build, only where browsers allow it (https, or localhost),
 * and only once the page has loaded, so the first open does not wait for it. The files this page
 * already loaded (before the worker was there to see them) are handed to it to keep, and so is
 * every build file loaded later; they come from the browser's cache, not the network.
 */
export function registerServiceWorker(): void {
  if (!import.meta.env.PROD || !('serviceWorker' in navigator) || !window.isSecureContext) return;
  const register = () => {
    const wb = new Workbox('/sw.js', { scope: '/' });
    const keep = (urlsToCache: string[]) => {
      if (urlsToCache.length > 0) {
        void wb.messageSW({ type: 'CACHE_URLS', payload: { urlsToCache } }).catch(() => undefined);
      }
    };
    void wb.register().then(
      () => {
        keep(loadedAssets());
        new PerformanceObserver((list) =>
          keep(
            list
              .getEntries()
              .map((entry) => entry.name)
              .filter((name) => name.startsWith(ASSETS)),
          ),
        ).observe({ type: 'resource' });
      },
      () => undefined,
    );
  };
  if (document.readyState === 'complete') register();
  else window.addEventListener('load', register, { once: true });
}
