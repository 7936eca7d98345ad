import { Router } from 'express';
import { idParamSchema } from '../../shared/schemas/common';
import { createFoodSynonymInputSchema } from '../../shared/schemas/food-synonym';
import type { Config } from '../config';
import { requireAuth, requireRole } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { createFoodSynonym, deleteFoodSynonym, listFoodSynonyms } from '../services/food-synonyms.service';

/** The synonym table food search uses: admin only. */
export function foodSynonymsRouter(config: Config) {
  const router = Router();
  router.use('/admin/food-synonyms', requireAuth(config), requireRole('admin'));
  router.get('/admin/food-synonyms', async (_req, res) => {
    res.json({ synonyms: await listFoodSynonyms() });
  });
  router.post('/admin/food-synonyms', validate({ body: createFoodSynonymInputSchema }), async (req, res) => {
    res.status(201).json({ synonym: await createFoodSynonym(req.body, req.auth!.user.id) });
  });
  router.delete('/admin/food-synonyms/:id', validate({ params: idParamSchema }), async (req, res) => {
    await deleteFoodSynonym(Number(req.params.id));
    res.status(204).end();
  });
  return router;
}
