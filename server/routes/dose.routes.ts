import { profileIdParamSchema } from '../../shared/schemas/common';
import { doseRequestSchema } from '../../shared/schemas/dose';
import { suggestDose } from '../services/dose.service';
import { access, defineRoute, type AnyRoute } from './registry';

/** Dose suggestions: computed by the shared engine on the server, never stored here. */
export function doseRoutes(): AnyRoute[] {
  return [
    defineRoute({
      method: 'post', path: '/profiles/:profileId/dose-suggestions', access: access.profile('dose.check'),
      params: profileIdParamSchema, body: doseRequestSchema,
      summary: 'A dose suggestion with every part of the sum, warnings and cautions (not stored).',
      handler: async ({ params, body }, _req, res) => res.json(await suggestDose(params.profileId, body)),
    }),
  ];
}
