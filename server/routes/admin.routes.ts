import { Router } from 'express';
import type { Config } from '../config';
import { requireAuth, requireRole } from '../middleware/auth';
import { listUsers } from '../services/users.service';

/** Admin-only account management. */
export function adminRouter(config: Config) {
  const router = Router();
  router.use('/admin', requireAuth(config), requireRole('admin'));
  router.get('/admin/users', async (_req, res) => {
    res.json({ users: await listUsers() });
  });
  return router;
}
