import { idParamSchema } from '../../shared/schemas/common';
import { createFoodSynonymInputSchema } from '../../shared/schemas/food-synonym';
import { createFoodSynonym, deleteFoodSynonym, listFoodSynonyms } from '../services/food-synonyms.service';
import { access, defineRoute, type AnyRoute } from './registry';

/** The synonym table food search uses: admin only. */
export function foodSynonymsRoutes(): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/admin/food-synonyms', summary: 'Every food synonym search uses, with where it comes from.', access: access.role('admin'),
      handler: async (_ctx, _req, res) => res.json({ synonyms: await listFoodSynonyms() }),
    }),
    defineRoute({
      method: 'post', path: '/admin/food-synonyms', summary: 'Adds a synonym (a word and the word it means, with its source).', access: access.role('admin'),
      body: createFoodSynonymInputSchema, status: 201,
      handler: async ({ body, user }, _req, res) => res.status(201).json({ synonym: await createFoodSynonym(body, user.id) }),
    }),
    defineRoute({
      method: 'delete', path: '/admin/food-synonyms/:id', summary: 'Removes a synonym.', access: access.role('admin'),
      params: idParamSchema, status: 204,
      handler: async ({ params }, _req, res) => {
        await deleteFoodSynonym(params.id);
        res.status(204).end();
      },
    }),
  ];
}
