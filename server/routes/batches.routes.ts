import type { Request } from 'express';
import { profileIdParamSchema } from '../../shared/schemas/common';
import { batchListQuerySchema, batchParamsSchema, createBatchInputSchema, updateBatchInputSchema } from '../../shared/schemas/batch';
import type { Config } from '../config';
import { createBatch, getBatch, listBatches, updateBatch } from '../services/batches.service';
import { buildLabelSheet } from '../services/labels.service';
import { access, defineRoute, type AnyRoute, type AppDeps } from './registry';

/** PUBLIC_URL when set (behind a proxy), else the origin the request came to. */
function originOf(config: Config, req: Request): string {
  return config.PUBLIC_URL ?? `${req.protocol}://${req.get('host')}`;
}

/** Cooked batches of a profile: save a cook, the inventory, a batch page, storage changes and the label sheet. */
export function batchesRoutes({ config }: AppDeps): AnyRoute[] {
  const read = access.profile('kitchen.read');
  const write = access.profile('kitchen.write');
  const base = '/profiles/:profileId/batches';
  return [
    defineRoute({
      method: 'get', path: base, access: read, params: profileIdParamSchema, query: batchListQuerySchema,
      summary: 'The inventory, newest cook first, with portion counts and codes (`include=available|all`).',
      handler: async ({ params, query }, _req, res) => res.json({ items: await listBatches(params.profileId, query.include) }),
    }),
    defineRoute({
      method: 'post', path: base, access: write, params: profileIdParamSchema, body: createBatchInputSchema, status: 201,
      summary: 'Save a whole cook at once: weighed lines, cooked weight, the split (equal or weighed) and the use-by date.',
      handler: async ({ params, user, body }, _req, res) => res.status(201).json(await createBatch(params.profileId, user.id, body)),
    }),
    defineRoute({
      method: 'get', path: `${base}/:id`, access: read, params: batchParamsSchema, summary: 'A batch page with its snapshot and portions.',
      handler: async ({ params }, _req, res) => res.json(await getBatch(params.profileId, params.id)),
    }),
    defineRoute({
      method: 'patch', path: `${base}/:id`, access: write, params: batchParamsSchema, body: updateBatchInputSchema,
      summary: 'Move between fridge and freezer or correct the use-by date.',
      handler: async ({ params, body }, _req, res) => res.json(await updateBatch(params.profileId, params.id, body)),
    }),
    defineRoute({
      method: 'get', path: `${base}/:id/labels`, access: read, params: batchParamsSchema, summary: 'The printable label sheet (QR codes as PNG data).',
      handler: async ({ params }, req, res) => res.json(await buildLabelSheet(params.profileId, params.id, originOf(config, req))),
    }),
  ];
}
