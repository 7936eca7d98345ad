import { profileIdParamSchema } from '../../shared/schemas/common';
import {
  acceptInvitationInputSchema,
  accessChangeInputSchema,
  accessUserParamSchema,
  invitationIdParamSchema,
  invitationInputSchema,
  invitationTokenParamSchema,
  managedProfileInputSchema,
} from '../../shared/schemas/access';
import {
  acceptInvitation,
  cancelInvitation,
  changePermissions,
  createManagedProfile,
  invite,
  listAccess,
  listAudit,
  previewInvitation,
  revokeAccess,
} from '../services/access.service';
import { getMe } from '../services/auth.service';
import { access, defineRoute, type AnyRoute } from './registry';

/** The care team: managed profiles, invitations, who has access, permissions, revocation and the audit. */
export function accessRoutes(): AnyRoute[] {
  const manage = access.profile('access.manage');
  const base = '/profiles/:profileId';
  return [
    defineRoute({
      method: 'post', path: '/profiles', access: access.signedIn, body: managedProfileInputSchema, status: 201,
      summary: 'Create a profile you keep for someone without an account (a child); hand it over later by inviting them as owner.',
      handler: async ({ user, body }, _req, res) => {
        const { id } = await createManagedProfile(user.id, body);
        res.status(201).json({ id, me: await getMe(user.id) });
      },
    }),
    defineRoute({
      method: 'get', path: `${base}/access`, access: manage, params: profileIdParamSchema,
      summary: 'Everyone with access (role, extra permissions, since when) and the open invitations (owner).',
      handler: async ({ params: p }, _req, res) => res.json(await listAccess(p.profileId)),
    }),
    defineRoute({
      method: 'post', path: `${base}/invitations`, access: manage, params: profileIdParamSchema, body: invitationInputSchema, status: 201,
      summary: 'Invite an address as carer or clinician (or owner, to hand over a managed profile); the single-use link is e-mailed.',
      handler: async ({ params: p, user, body }, _req, res) => res.status(201).json(await invite(p.profileId, user.id, body)),
    }),
    defineRoute({
      method: 'delete', path: `${base}/invitations/:invitationId`, access: manage, params: invitationIdParamSchema, status: 204,
      summary: 'Withdraw an open invitation.',
      handler: async ({ params: p, user }, _req, res) => {
        await cancelInvitation(p.profileId, p.invitationId, user.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'patch', path: `${base}/access/:userId`, access: manage, params: accessUserParamSchema, body: accessChangeInputSchema,
      summary: 'Change a carer\'s or clinician\'s extra permissions (`settings` for a carer, `ratios` for a clinician).',
      handler: async ({ params: p, user, body }, _req, res) => res.json(await changePermissions(p.profileId, p.userId, user.id, body)),
    }),
    defineRoute({
      method: 'delete', path: `${base}/access/:userId`, access: manage, params: accessUserParamSchema, status: 204,
      summary: 'Revoke someone\'s access: from their next request the profile answers 404. They get an e-mail.',
      handler: async ({ params: p, user }, _req, res) => {
        await revokeAccess(p.profileId, p.userId, user.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get', path: `${base}/audit`, access: manage, params: profileIdParamSchema,
      summary: 'Grants, permission changes, revocations and settings changes on the profile, newest first (owner).',
      handler: async ({ params: p }, _req, res) => res.json({ entries: await listAudit(p.profileId) }),
    }),
    defineRoute({
      method: 'get', path: '/invitations/:token', access: access.public, params: invitationTokenParamSchema,
      summary: 'What an invitation link offers (profile, inviter, role, invited address, open/expired/used); 404 for an unknown link.',
      handler: async ({ params: p }, _req, res) => res.json(await previewInvitation(p.token)),
    }),
    defineRoute({
      method: 'post', path: '/invitations/accept', access: access.signedIn, body: acceptInvitationInputSchema,
      summary: 'Accept an invitation with the account that uses the invited address (single use; 409 when used or expired).',
      handler: async ({ user, body }, _req, res) => {
        const { profileId } = await acceptInvitation(body.token, user.id);
        res.json({ profileId, me: await getMe(user.id) });
      },
    }),
  ];
}
