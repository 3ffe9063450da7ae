/**
 * After `astro build`: writes dist/client/sw.js with Workbox's generateSW. The worker precaches the
 * built assets and fonts, and keeps the field records and plans a person opens (their pages, and
 * a plan's API answer; network first) in caches that sw-sign-out.js empties when that person signs out.
 */
import { generateSW } from 'workbox-build';

const PAGES = 'bondmap-person-pages';
const DATA = 'bondmap-person-data';

const { count, size, warnings } = await generateSW({
  globDirectory: 'dist/client',
  globPatterns: ['**/*.{js,css,woff,woff2,svg,png,webmanifest}'],
  globIgnores: ['sw.js', 'workbox-*.js'],
  swDest: 'dist/client/sw.js',
  importScripts: ['/sw-sign-out.js'],
  clientsClaim: true,
  skipWaiting: true,
  cleanupOutdatedCaches: true,
  // Built asset names carry a content hash: no need to add a revision to the URL.
  dontCacheBustURLsMatching: /^_astro\//,
  maximumFileSizeToCacheInBytes: 5 * 1024 * 1024,
  runtimeCaching: [
    {
      urlPattern: ({ request, url }) => request.mode === 'navigate' && /^\/(records|plans)\/\d+$/.test(url.pathname),
      handler: 'NetworkFirst',
      options: { cacheName: PAGES, networkTimeoutSeconds: 8, cacheableResponse: { statuses: [200] }, expiration: { maxEntries: 60 } },
    },
    {
      // Plans only: the field screen keeps its own copy of a record (IndexedDB), so that "in step
      // with the server" is never said of an answer that came from a cache.
      urlPattern: ({ url }) => /^\/api\/plans\/\d+$/.test(url.pathname),
      handler: 'NetworkFirst',
      method: 'GET',
      options: { cacheName: DATA, networkTimeoutSeconds: 8, cacheableResponse: { statuses: [200] }, expiration: { maxEntries: 120 } },
    },
  ],
});
for (const warning of warnings) console.warn(`[worker] ${warning}`);
console.log(`[worker] dist/client/sw.js precaches ${count} files (${Math.round(size / 1024)} KiB)`);
