import { adminAuditListSchema, adminUserListSchema, adminUserQuerySchema, adminUserSchema, changeRoleInputSchema, disableAccountInputSchema } from '../../shared/schemas/accounts-admin';
import { idParamSchema } from '../../shared/schemas/common';
import { changeUserRole, listAdminAudit, listUsers, setUserDisabled } from '../services/users.service';
import { access, defineRoute, type AnyRoute } from './registry';

/** Admin-only account management: search, role, disable, and the audit of those changes. */
export function adminRoutes(): AnyRoute[] {
  const admin = access.role('admin');
  return [
    defineRoute({
      method: 'get', path: '/admin/users', summary: 'Accounts, oldest first; `q` searches the e-mail address and name.', access: admin,
      query: adminUserQuerySchema, response: adminUserListSchema,
      handler: async ({ query }, _req, res) => res.json({ users: await listUsers(query.q) }),
    }),
    defineRoute({
      method: 'put', path: '/admin/users/:id/role', summary: 'Change an account\'s role, with the reason recorded (not your own).', access: admin,
      params: idParamSchema, body: changeRoleInputSchema, response: adminUserSchema,
      handler: async ({ params, body, user }, _req, res) => res.json(await changeUserRole(user.id, params.id, body)),
    }),
    defineRoute({
      method: 'post', path: '/admin/users/:id/disable', summary: 'Disable an account with the reason recorded: it cannot sign in and its sessions end.', access: admin,
      params: idParamSchema, body: disableAccountInputSchema, response: adminUserSchema,
      handler: async ({ params, body, user }, _req, res) => res.json(await setUserDisabled(user.id, params.id, true, body.reason)),
    }),
    defineRoute({
      method: 'post', path: '/admin/users/:id/enable', summary: 'Enable a disabled account again.', access: admin,
      params: idParamSchema, body: disableAccountInputSchema, response: adminUserSchema,
      handler: async ({ params, body, user }, _req, res) => res.json(await setUserDisabled(user.id, params.id, false, body.reason)),
    }),
    defineRoute({
      method: 'get', path: '/admin/audit', summary: 'Role changes, disabled or enabled accounts, and access to profiles given, changed or revoked: the newest 200, newest first.', access: admin, response: adminAuditListSchema,
      handler: async (_ctx, _req, res) => res.json({ entries: await listAdminAudit() }),
    }),
  ];
}
