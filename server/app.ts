import express from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Sequelize } from 'sequelize';
import { trustProxy, type Config } from './config';
import { PhotoProcessor } from './lib/photo-worker';
import { requestCache } from './lib/request-cache';
import { s3Storage } from './lib/s3-storage';
import { localDiskStorage, type FileStorage } from './lib/storage';
import { logger } from './logger';
import { MailSender } from './mail/mail-sender';
import { errorHandler, notFoundHandler } from './middleware/error-handler';
import { apiRouter } from './routes';
import type { AppDeps } from './routes/registry';
import { configureMail } from './services/mail.service';
import { configurePhotoSigning } from './services/photos.service';
import { serveWeb } from './web';

/** The one file storage the configuration names: the uploads folder on local disk (default) or an S3-compatible bucket. */
export function configuredStorage(config: Config): FileStorage {
  if (config.STORAGE === 'disk') return localDiskStorage(config.UPLOADS_DIR);
  return s3Storage({
    bucket: config.S3_BUCKET!,
    region: config.S3_REGION!,
    endpoint: config.S3_ENDPOINT,
    accessKeyId: config.S3_ACCESS_KEY_ID,
    secretAccessKey: config.S3_SECRET_ACCESS_KEY,
    forcePathStyle: config.S3_FORCE_PATH_STYLE === '1',
  });
}

/**
 * Builds the Express app (API + web build); server/index.ts calls listen(), tests use supertest. The one file storage
 * and the one photo processor (at most two decodes at once) are made here and handed to every route that stores or serves a file.
 */
export function createApp(config: Config, sequelize: Sequelize) {
  logger.level = config.LOG_LEVEL;
  configurePhotoSigning(config.jwtSecret);
  configureMail(config);
  const deps: AppDeps = { config, sequelize, storage: configuredStorage(config), photos: new PhotoProcessor(2) };
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', trustProxy(config));
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          // No inline scripts: a script injected into a page cannot run (the export has none; see tests/server/csp.test.ts).
          'script-src': ["'self'"],
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
  // API answers carry personal data (doses, glucose settings, recipes): no browser or proxy may keep them. The signed
  // photo route sets its own private caching.
  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  app.use('/api', requestCache, apiRouter(deps));
  app.use('/api', notFoundHandler);
  serveWeb(app, config.WEB_DIST_DIR);
  app.use(errorHandler);
  const mail = new MailSender(config, sequelize);
  mail.start();
  app.locals.mailSender = mail;
  return app;
}

/** The mail sender createApp started (to stop it, or to learn the fake SMTP port). */
export function mailSenderOf(app: express.Express): MailSender {
  return app.locals.mailSender as MailSender;
}

/** Stops what createApp started in the background (the mail sender and its fake SMTP server); the pool stays open. */
export async function stopApp(app: express.Express): Promise<void> {
  await mailSenderOf(app)?.stop();
}
