import { Router } from 'express';
import { z } from 'zod';
import { doseRequestSchema } from '../../shared/schemas/dose';
import type { Config } from '../config';
import { requireAuth, requireProfileAccess } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { suggestDose } from '../services/dose.service';

const profileParams = z.object({ profileId: z.coerce.number().int().positive('Not a valid id.') });

/** Dose suggestions: computed by the shared engine on the server, never stored here. */
export function doseRouter(config: Config) {
  const router = Router();
  router.post(
    '/profiles/:profileId/dose-suggestions',
    requireAuth(config),
    requireProfileAccess(['owner', 'carer', 'clinician']),
    validate({ params: profileParams, body: doseRequestSchema }),
    async (req, res) => {
      res.json(await suggestDose(Number(req.params.profileId), req.body));
    },
  );
  return router;
}
