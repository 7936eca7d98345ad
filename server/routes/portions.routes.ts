import { Router } from 'express';
import { z } from 'zod';
import { portionCodeParamSchema } from '../../shared/schemas/portion';
import type { Config } from '../config';
import { requireAuth } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { getPortion, setPortionStatus } from '../services/portions.service';

const statusBodySchema = z.object({ status: z.enum(['eaten', 'discarded'], { error: 'Choose eaten or discarded.' }) });

/** A portion by its label code: its page, and marking it eaten or thrown away (once). */
export function portionsRouter(config: Config) {
  const router = Router();
  const auth = requireAuth(config);

  router.get('/portions/:code', auth, validate({ params: portionCodeParamSchema }), async (req, res) => {
    res.json(await getPortion(String(req.params.code), req.auth!.user.id));
  });
  router.post('/portions/:code/status', auth, validate({ params: portionCodeParamSchema, body: statusBodySchema }), async (req, res) => {
    res.json(await setPortionStatus(String(req.params.code), req.auth!.user.id, req.body.status));
  });
  return router;
}
