import fs from 'node:fs';
import path from 'node:path';
import express, { type Express, type Request, type Response } from 'express';

// Hashed file names (the build's _expo/ and assets/ folders) never change content: a browser may keep them a year.
const IMMUTABLE = 'public, max-age=31536000, immutable';

/** The offline app shell's service worker (server/lib/service-worker.ts), at the root of the build. */
export const SERVICE_WORKER_FILE = 'sw.js';

function cacheControl(file: string): string | null {
  // The service worker is checked for updates on every visit: a year-long copy would pin an old app shell.
  if (file.endsWith('.html') || file.endsWith('.webmanifest') || path.basename(file) === SERVICE_WORKER_FILE) return 'no-cache';
  if (file.includes(`${path.sep}_expo${path.sep}`) || file.includes(`${path.sep}assets${path.sep}`)) return IMMUTABLE;
  return null;
}

/**
 * The brotli or gzip copy made at export (server/cli/compress-web.ts) when the browser accepts it; else null and the
 * plain file is sent. `Vary: Accept-Encoding` either way, so caches keep the variants apart.
 */
function sendPrecompressed(req: Request, res: Response, file: string): boolean {
  res.vary('Accept-Encoding');
  const accepts = String(req.headers['accept-encoding'] ?? '');
  for (const [encoding, ext] of [['br', '.br'], ['gzip', '.gz']] as const) {
    if (!new RegExp(`\\b${encoding}\\b`).test(accepts) || !fs.existsSync(file + ext)) continue;
    res.setHeader('Content-Encoding', encoding);
    res.type(path.extname(file));
    const cache = cacheControl(file);
    if (cache) res.setHeader('Cache-Control', cache);
    res.sendFile(file + ext, { cacheControl: false });
    return true;
  }
  return false;
}

/**
 * Serves the exported web app, falling back to index.html for client-side routes. Text files go out as the brotli or
 * gzip copy made at export; hashed files are immutable, index.html is always revalidated.
 */
export function serveWeb(app: Express, distDir: string) {
  const index = path.join(distDir, 'index.html');
  const root = path.resolve(distDir);
  app.use((req, res, next) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || req.path.startsWith('/api/')) return next();
    let file: string;
    try {
      file = path.join(root, decodeURIComponent(req.path));
    } catch {
      return next();
    }
    if (!file.startsWith(root + path.sep) || file.endsWith('.br') || file.endsWith('.gz')) return next();
    if (!fs.existsSync(file) || !fs.statSync(file).isFile()) return next();
    if (!sendPrecompressed(req, res, file)) next();
  });
  app.use(
    express.static(distDir, {
      index: false,
      setHeaders: (res, file) => {
        const cache = cacheControl(file);
        if (cache) res.setHeader('Cache-Control', cache);
      },
    }),
  );
  app.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/api/') || !req.accepts('html')) return next();
    if (!fs.existsSync(index)) {
      res.status(503).type('text').send('The web app has not been built yet. Run npm start.');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    if (!sendPrecompressed(req, res, index)) res.sendFile(index);
  });
}
