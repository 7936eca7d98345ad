/**
 * One API copy without npm start's preparation (migrations, food tables, demo): for running several copies behind a
 * load balancer, after server/cli/prepare.ts has prepared the database once.
 */
import { logger } from '../logger';
import { startServer } from '../index';

startServer().catch((err) => {
  logger.fatal({ err }, 'failed to start');
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
