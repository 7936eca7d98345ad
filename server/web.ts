import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';

/** Serves the exported web app, falling back to index.html for client-side routes. */
export function serveWeb(app: Express, distDir: string) {
  const index = path.join(distDir, 'index.html');
  app.use(
    express.static(distDir, {
      index: false,
      setHeaders: (res, file) => {
        if (file.endsWith('.html')) res.setHeader('Cache-Control', 'no-cache');
        else if (file.includes(`${path.sep}_expo${path.sep}`) || file.includes(`${path.sep}assets${path.sep}`)) {
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        }
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
    res.sendFile(index);
  });
}
