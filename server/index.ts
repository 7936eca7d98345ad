import { createApp, stopApp } from './app';
import { loadConfig, publicUrl } from './config';
import { createSequelize } from './db';
import { logger } from './logger';

/** Connects to the database and listens; SIGINT/SIGTERM close the server and the pool. */
export async function startServer(): Promise<void> {
  const config = loadConfig();
  const sequelize = createSequelize(config.DATABASE_URL, { poolMax: config.DB_POOL_MAX, acquireTimeoutMs: config.DB_ACQUIRE_TIMEOUT_MS });
  await sequelize.authenticate();
  const app = createApp(config, sequelize);
  const server = app.listen(config.PORT, config.HOST, () => {
    const url = publicUrl(config);
    logger.info({ url }, 'Carbwright is listening');
    process.stdout.write(`\n  Carbwright is ready: ${url}\n\n`);
  });
  const shutdown = () => {
    server.close(() => void stopApp(app).then(() => sequelize.close()).then(() => process.exit(0)));
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

