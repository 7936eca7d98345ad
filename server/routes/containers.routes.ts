import { Router } from 'express';
import { z } from 'zod';
import { createContainerInputSchema, updateContainerInputSchema } from '../../shared/schemas/container';
import type { Config } from '../config';
import { requireAuth, requireProfileAccess } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { createContainer, deleteContainer, listContainers, updateContainer } from '../services/containers.service';

const profileParams = z.object({ profileId: z.coerce.number().int().positive('Not a valid id.') });
const containerParams = profileParams.extend({ id: z.coerce.number().int().positive('Not a valid id.') });

/** Saved pots and containers (with tares) of a profile. Clinicians may look but not change them. */
export function containersRouter(config: Config) {
  const router = Router();
  const auth = requireAuth(config);
  const read = requireProfileAccess();
  const write = requireProfileAccess(['owner', 'carer']);
  const base = '/profiles/:profileId/containers';

  router.get(base, auth, read, validate({ params: profileParams }), async (req, res) => {
    res.json({ items: await listContainers(Number(req.params.profileId)) });
  });
  router.post(base, auth, write, validate({ params: profileParams, body: createContainerInputSchema }), async (req, res) => {
    res.status(201).json(await createContainer(Number(req.params.profileId), req.body));
  });
  router.patch(`${base}/:id`, auth, write, validate({ params: containerParams, body: updateContainerInputSchema }), async (req, res) => {
    res.json(await updateContainer(Number(req.params.profileId), Number(req.params.id), req.body));
  });
  router.delete(`${base}/:id`, auth, write, validate({ params: containerParams }), async (req, res) => {
    await deleteContainer(Number(req.params.profileId), Number(req.params.id));
    res.status(204).end();
  });
  return router;
}
