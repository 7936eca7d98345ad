import { profileIdParamSchema, profileItemParamSchema } from '../../shared/schemas/common';
import { containerSchema, createContainerInputSchema, updateContainerInputSchema } from '../../shared/schemas/container';
import { createContainer, deleteContainer, listContainers, updateContainer } from '../services/containers.service';
import { access, defineRoute, type AnyRoute } from './registry';

/** Saved pots and containers (with tares) of a profile. Clinicians may look but not change them. */
export function containersRoutes(): AnyRoute[] {
  const read = access.profile('kitchen.read');
  const write = access.profile('kitchen.write');
  const base = '/profiles/:profileId/containers';
  return [
    defineRoute({
      method: 'get', path: base, access: read, params: profileIdParamSchema, summary: 'Saved pots and containers with their tares.',
      handler: async ({ params }, _req, res) => res.json({ items: await listContainers(params.profileId) }),
    }),
    defineRoute({
      method: 'post', path: base, access: write, params: profileIdParamSchema, body: createContainerInputSchema, status: 201, response: containerSchema,
      summary: 'Save a pot or container with its empty weight.',
      handler: async ({ params, body }, _req, res) => res.status(201).json(await createContainer(params.profileId, body)),
    }),
    defineRoute({
      method: 'patch', path: `${base}/:id`, access: write, params: profileItemParamSchema, body: updateContainerInputSchema, response: containerSchema,
      summary: 'Rename or re-weigh a container.',
      handler: async ({ params, body }, _req, res) => res.json(await updateContainer(params.profileId, params.id, body)),
    }),
    defineRoute({
      method: 'delete', path: `${base}/:id`, access: write, params: profileItemParamSchema, status: 204, summary: 'Delete a container.',
      handler: async ({ params }, _req, res) => {
        await deleteContainer(params.profileId, params.id);
        res.status(204).end();
      },
    }),
  ];
}
