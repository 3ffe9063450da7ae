/**
 * Registers the service worker (dist/client/sw.js, written by scripts/build-worker.mjs) from a
 * bundled island, never an inline script, so it runs under a strict script policy. The page that
 * asked is put in the person's page cache at once: it was loaded before the worker was there.
 */
export const PAGES_CACHE = 'bondmap-person-pages';

export async function registerWorker(): Promise<void> {
  if (!('serviceWorker' in navigator) || !('caches' in window) || !navigator.onLine) return;
  try {
    await navigator.serviceWorker.register('/sw.js');
    await navigator.serviceWorker.ready;
    const cache = await caches.open(PAGES_CACHE);
    const page = await fetch(location.href, { credentials: 'same-origin' });
    if (page.ok && !page.redirected) await cache.put(location.href, page);
  } catch {
    // No worker (a private window, an old browser): the screen still works while online.
  }
}
