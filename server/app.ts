import express from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Sequelize } from 'sequelize';
import type { Config } from './config';
import { logger } from './logger';
import { errorHandler, notFoundHandler } from './middleware/error-handler';
import { apiRouter } from './routes';
import { serveWeb } from './web';

/** Builds the Express app (API + web build); server/index.ts calls listen(), tests use supertest. */
export function createApp(config: Config, sequelize: Sequelize) {
  logger.level = config.LOG_LEVEL;
  const app = express();
  app.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'", "'unsafe-inline'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          // served over plain http on loopback or a LAN address: do not force https sub-requests
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  if (config.NODE_ENV !== 'test') {
    app.use(
      pinoHttp({
        logger,
        autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
        serializers: {
          req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url?.split('?')[0] }),
          res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
        },
      }),
    );
  }
  app.use(express.json({ limit: '1mb' }));
  app.use('/api', apiRouter(config, sequelize));
  app.use('/api', notFoundHandler);
  serveWeb(app, config.WEB_DIST_DIR);
  app.use(errorHandler);
  return app;
}
