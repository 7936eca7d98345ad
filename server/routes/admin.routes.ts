import { listUsers } from '../services/users.service';
import { access, defineRoute, type AnyRoute } from './registry';

/** Admin-only account management. */
export function adminRoutes(): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/admin/users', summary: 'Every account.', access: access.role('admin'),
      handler: async (_ctx, _req, res) => res.json({ users: await listUsers() }),
    }),
  ];
}
