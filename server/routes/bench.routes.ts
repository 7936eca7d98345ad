import { Router } from 'express';
import type { Sequelize } from 'sequelize';

/** Only mounted when BENCH_ROUTES=1: a bare database round trip, the floor for npm run bench. */
export function benchRouter(sequelize: Sequelize) {
  const router = Router();
  router.get('/bench/floor', async (_req, res) => {
    const [rows] = await sequelize.query('SELECT 1 AS one');
    res.json(rows[0]);
  });
  return router;
}
