import path from 'node:path';
import { generateSW } from 'workbox-build';
import { SERVICE_WORKER_FILE } from '../web';

/**
 * Writes the offline app shell's service worker (Workbox) into an exported web build: it precaches index.html, every
 * JavaScript and CSS chunk (routes are split, and Today and the kitchen must open offline), the fonts, icons and the
 * manifest, and answers app navigations with index.html. It caches nothing from /api: answers there carry personal
 * data and `no-store`; the offline copy of Today and the fridge list is the app's own (components/api/offline-copy.ts).
 * Run after `expo export` and before the brotli/gzip step, so the precache list matches the files served.
 */
export async function buildServiceWorker(distDir: string) {
  const { count, size, warnings } = await generateSW({
    globDirectory: distDir,
    globPatterns: ['index.html', 'manifest.webmanifest', 'favicon.ico', 'icon-*.png', '_expo/static/**/*.{js,css}', 'assets/**/*.{ttf,otf,woff,woff2,png,svg}'],
    globIgnores: ['**/*.br', '**/*.gz', '**/*.map'],
    swDest: path.join(distDir, SERVICE_WORKER_FILE),
    // The first build's one chunk is 2.1 MB; Workbox skips files over 2 MB by default.
    maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
    // Metro and Expo put a content hash in these names already.
    dontCacheBustURLsMatching: /^(_expo|assets)\//,
    navigateFallback: '/index.html',
    navigateFallbackDenylist: [/^\/api\//],
    inlineWorkboxRuntime: true,
    mode: 'production',
    sourcemap: false,
    skipWaiting: true,
    clientsClaim: true,
    cleanupOutdatedCaches: true,
  });
  return { count, size, warnings };
}
