import { Router, type Request } from 'express';
import { z } from 'zod';
import { batchListQuerySchema, batchParamsSchema, createBatchInputSchema, updateBatchInputSchema } from '../../shared/schemas/batch';
import type { Config } from '../config';
import { requireAuth, requireProfileAccess } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { createBatch, getBatch, listBatches, updateBatch } from '../services/batches.service';
import { buildLabelSheet } from '../services/labels.service';

const profileParams = z.object({ profileId: z.coerce.number().int().positive('Not a valid id.') });

/** PUBLIC_URL when set (behind a proxy), else the origin the request came to. */
function originOf(config: Config, req: Request): string {
  return config.PUBLIC_URL ?? `${req.protocol}://${req.get('host')}`;
}

/** Cooked batches of a profile: save a cook, the inventory, a batch page, storage changes and the label sheet. */
export function batchesRouter(config: Config) {
  const router = Router();
  const auth = requireAuth(config);
  const read = requireProfileAccess();
  const write = requireProfileAccess(['owner', 'carer']);
  const base = '/profiles/:profileId/batches';

  router.get(base, auth, read, validate({ params: profileParams, query: batchListQuerySchema }), async (req, res) => {
    const { include } = req.query as z.infer<typeof batchListQuerySchema>;
    res.json({ items: await listBatches(Number(req.params.profileId), include) });
  });
  router.post(base, auth, write, validate({ params: profileParams, body: createBatchInputSchema }), async (req, res) => {
    res.status(201).json(await createBatch(Number(req.params.profileId), req.auth!.user.id, req.body));
  });
  router.get(`${base}/:id`, auth, read, validate({ params: batchParamsSchema }), async (req, res) => {
    res.json(await getBatch(Number(req.params.profileId), Number(req.params.id)));
  });
  router.patch(`${base}/:id`, auth, write, validate({ params: batchParamsSchema, body: updateBatchInputSchema }), async (req, res) => {
    res.json(await updateBatch(Number(req.params.profileId), Number(req.params.id), req.body));
  });
  router.get(`${base}/:id/labels`, auth, read, validate({ params: batchParamsSchema }), async (req, res) => {
    res.json(await buildLabelSheet(Number(req.params.profileId), Number(req.params.id), originOf(config, req)));
  });
  return router;
}
