import { z } from 'zod';
import { grantPermissionSchema, profileAccessRoleSchema, userRoleSchema, userSchema } from './auth';

/** An account as the admin sees it: the public shape plus whether and why it is disabled. */
export const adminUserSchema = userSchema.extend({
  disabledAt: z.string().nullable(),
  disabledReason: z.string().nullable(),
});
export type AdminUser = z.infer<typeof adminUserSchema>;
export const adminUserListSchema = z.object({ users: z.array(adminUserSchema) });

/** Search by part of the e-mail address or name. */
export const adminUserQuerySchema = z.object({ q: z.string().trim().max(100).optional() });

const reasonSchema = z.string().trim().min(3, 'Say why, in a few words.').max(500, 'Use at most 500 characters.');

export const changeRoleInputSchema = z.object({ role: userRoleSchema, reason: reasonSchema });
export type ChangeRoleInput = z.infer<typeof changeRoleInputSchema>;

export const disableAccountInputSchema = z.object({ reason: reasonSchema });
export type DisableAccountInput = z.infer<typeof disableAccountInputSchema>;

const auditPersonSchema = z.object({ id: z.number().int(), email: z.string() });

/** An admin's change to an account: its role, or disabling and enabling it, with the reason. */
export const accountAuditEntrySchema = z.object({
  source: z.literal('account'),
  id: z.number().int(),
  action: z.enum(['role_changed', 'disabled', 'enabled']),
  user: auditPersonSchema,
  actor: auditPersonSchema.nullable(),
  oldValue: z.string().nullable(),
  newValue: z.string().nullable(),
  reason: z.string().nullable(),
  createdAt: z.string(),
});
export type AccountAuditEntry = z.infer<typeof accountAuditEntrySchema>;

/** A change of who may open a profile: an invitation, a grant (an accepted invitation), a change, a revocation. */
export const accessAuditEntrySchema = z.object({
  source: z.literal('access'),
  id: z.number().int(),
  action: z.enum(['invited', 'invitation_cancelled', 'granted', 'changed', 'revoked', 'handed_over']),
  profile: z.object({ id: z.number().int(), displayName: z.string() }),
  /** Whom it is about: their account, or only the invited address. */
  user: auditPersonSchema.nullable(),
  email: z.string().nullable(),
  actor: auditPersonSchema.nullable(),
  role: profileAccessRoleSchema.nullable(),
  permissions: z.array(grantPermissionSchema),
  createdAt: z.string(),
});
export type AccessAuditEntry = z.infer<typeof accessAuditEntrySchema>;

export const adminAuditEntrySchema = z.discriminatedUnion('source', [accountAuditEntrySchema, accessAuditEntrySchema]);
export type AdminAuditEntry = z.infer<typeof adminAuditEntrySchema>;
export const adminAuditListSchema = z.object({ entries: z.array(adminAuditEntrySchema) });
