import { z } from 'zod';
import { userRoleSchema, userSchema } from './auth';

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

export const accountAuditEntrySchema = z.object({
  id: z.number().int(),
  action: z.enum(['role_changed', 'disabled', 'enabled']),
  user: z.object({ id: z.number().int(), email: z.string() }),
  actor: z.object({ id: z.number().int(), email: z.string() }).nullable(),
  oldValue: z.string().nullable(),
  newValue: z.string().nullable(),
  reason: z.string().nullable(),
  createdAt: z.string(),
});
export type AccountAuditEntry = z.infer<typeof accountAuditEntrySchema>;
export const accountAuditListSchema = z.object({ entries: z.array(accountAuditEntrySchema) });
