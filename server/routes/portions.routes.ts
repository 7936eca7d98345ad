import { z } from 'zod';
import { portionCodeParamSchema, portionDetailSchema } from '../../shared/schemas/portion';
import { getPortion, setPortionStatus } from '../services/portions.service';
import { access, defineRoute, type AnyRoute } from './registry';

const statusBodySchema = z.object({ status: z.enum(['eaten', 'discarded', 'available'], { error: 'Choose eaten, discarded or available.' }) });

/** A portion by its label code: its page, and marking it eaten or thrown away (once), or undoing that. */
export function portionsRoutes(): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/portions/:code', access: access.signedIn, params: portionCodeParamSchema, response: portionDetailSchema,
      summary: 'A portion by its label code (any case, with or without the dash); 404 without access to its profile.',
      handler: async ({ params, user }, _req, res) => res.json(await getPortion(params.code, user.id)),
    }),
    defineRoute({
      method: 'post', path: '/portions/:code/status', access: access.signedIn, params: portionCodeParamSchema, body: statusBodySchema,
      response: portionDetailSchema, summary: 'Mark a portion eaten or discarded (from available only), or back to available (from eaten or discarded only; the undo); 409 otherwise. Clinicians may not.',
      handler: async ({ params, user, body }, _req, res) => res.json(await setPortionStatus(params.code, user.id, body.status)),
    }),
  ];
}
