import { Router } from 'express';
import type { Sequelize } from 'sequelize';

/** GET /api/health: answers 200 only when the database answers. */
export function healthRouter(sequelize: Sequelize) {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const started = process.hrtime.bigint();
    try {
      await sequelize.query('SELECT 1');
      const dbMs = Number(process.hrtime.bigint() - started) / 1e6;
      res.json({ status: 'ok', database: 'ok', dbMs: Math.round(dbMs * 100) / 100 });
    } catch {
      res.status(503).json({ error: { code: 'internal', message: 'The database is not answering.' } });
    }
  });
  return router;
}
