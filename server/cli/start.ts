/**
 * npm start's server process: the preparation steps, then the API and web app, in one process so a warm
 * restart pays for one TypeScript start-up instead of two.
 */
import { logger } from '../logger';
import { startServer } from '../index';
import { prepare } from './setup';

prepare()
  .then(startServer)
  .catch((err) => {
    logger.fatal({ err }, 'failed to start');
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
