import { z } from 'zod';
import { grantPermissionSchema, profileAccessRoleSchema, profileColourSchema as profileColourSchemaRef } from './auth';
import { positiveIdSchema, profileIdParamSchema } from './common';
import { timeZoneSchema } from './units';

export { grantPermissionSchema, profileColourSchema, PROFILE_COLOURS, type ProfileColour } from './auth';

/** Which extra permission each role can be given: a carer may edit settings, a clinician kinds of day and ratios. */
export const PERMISSIONS_FOR_ROLE = { owner: [], carer: ['settings'], clinician: ['ratios'] } as const;

const emailSchema = z
  .string()
  .trim()
  .min(1, 'Enter their email address.')
  .max(254, 'That email address is too long.')
  .pipe(z.email('Enter a valid email address.'))
  .transform((value) => value.toLowerCase());

/** POST /api/profiles/:profileId/invitations */
export const invitationInputSchema = z
  .object({
    email: emailSchema,
    role: profileAccessRoleSchema,
    permissions: z.array(grantPermissionSchema).max(2),
  })
  .superRefine((v, ctx) => {
    const allowed = PERMISSIONS_FOR_ROLE[v.role] as readonly string[];
    if (v.permissions.some((p) => !allowed.includes(p))) {
      ctx.addIssue({ code: 'custom', path: ['permissions'], message: v.role === 'owner' ? 'An owner needs no extra permissions.' : `A ${v.role} can only be given: ${allowed.join(', ')}.` });
    }
  });
export type InvitationInput = z.input<typeof invitationInputSchema>;

/** PATCH /api/profiles/:profileId/access/:userId */
export const accessChangeInputSchema = z.object({ permissions: z.array(grantPermissionSchema).max(2) });
export type AccessChangeInput = z.input<typeof accessChangeInputSchema>;

/** POST /api/profiles (a profile a carer keeps for someone without an account) */
export const managedProfileInputSchema = z.object({
  displayName: z.string().trim().min(1, 'Give the profile a name.').max(80, 'Use at most 80 characters.'),
  colour: profileColourSchemaRef.optional(),
  /** Where their day starts (IANA name); the creator's own profile's time zone when not given. */
  timeZone: timeZoneSchema.optional(),
});
export type ManagedProfileInput = z.input<typeof managedProfileInputSchema>;

/** POST /api/invitations/accept */
export const acceptInvitationInputSchema = z.object({ token: z.string().trim().min(20).max(200) });

export const invitationTokenParamSchema = z.object({ token: z.string().min(20).max(200) });
export const accessUserParamSchema = profileIdParamSchema.extend({ userId: positiveIdSchema });
export const invitationIdParamSchema = profileIdParamSchema.extend({ invitationId: positiveIdSchema });

export type AccessPerson = {
  userId: number;
  displayName: string;
  email: string;
  role: z.infer<typeof profileAccessRoleSchema>;
  permissions: z.infer<typeof grantPermissionSchema>[];
  since: string;
};
export type OpenInvitation = {
  id: number;
  email: string;
  role: z.infer<typeof profileAccessRoleSchema>;
  permissions: z.infer<typeof grantPermissionSchema>[];
  expiresAt: string;
  createdAt: string;
};
export type ProfileAccessList = { people: AccessPerson[]; invitations: OpenInvitation[] };

/** What the accept page shows before someone accepts. */
export type InvitationPreview = {
  profileName: string;
  inviterName: string;
  role: z.infer<typeof profileAccessRoleSchema>;
  permissions: z.infer<typeof grantPermissionSchema>[];
  email: string;
  status: 'open' | 'expired' | 'used';
};

export type AccessEventKind = 'invited' | 'invitation_cancelled' | 'granted' | 'changed' | 'revoked' | 'handed_over';
/** One line of a profile's audit: access events and settings changes, newest first. */
export type AuditEntry = {
  at: string;
  kind: AccessEventKind | 'settings';
  actorName: string | null;
  /** Whom an access event is about (name or invited address); for settings, what changed (e.g. "Units and safety"). */
  about: string | null;
  role: z.infer<typeof profileAccessRoleSchema> | null;
  permissions: z.infer<typeof grantPermissionSchema>[];
};
