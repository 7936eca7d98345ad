/**
 * Registers the offline app shell's service worker, which the web export writes as /sw.js (server/lib/service-worker.ts).
 * Only in a production web build: the development server and tests have none. A file the bundle loads, never an
 * inline script (the page's Content-Security-Policy allows scripts from this origin only).
 */
export function registerServiceWorker() {
  if (process.env.NODE_ENV !== 'production' || typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
  const register = () => void navigator.serviceWorker.register('/sw.js').catch(() => undefined);
  if (document.readyState === 'complete') register();
  else window.addEventListener('load', register, { once: true });
}
