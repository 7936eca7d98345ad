import { UNAVAILABLE_RETRY_AFTER_SECONDS } from '../middleware/error-handler';
import { access, defineRoute, type AnyRoute, type AppDeps } from './registry';

/** GET /api/health: answers 200 only when the database answers. */
export function healthRoutes({ sequelize }: AppDeps): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/health', access: access.public, summary: '200 when the database answers (with its round-trip time), else 503.',
      handler: async (_ctx, _req, res) => {
        const started = process.hrtime.bigint();
        try {
          await sequelize.query('SELECT 1');
          const dbMs = Number(process.hrtime.bigint() - started) / 1e6;
          res.json({ status: 'ok', database: 'ok', dbMs: Math.round(dbMs * 100) / 100 });
        } catch {
          res.set('Retry-After', String(UNAVAILABLE_RETRY_AFTER_SECONDS));
          res.status(503).json({ error: { code: 'unavailable', message: 'The database is not answering.' } });
        }
      },
    }),
  ];
}
