import { z } from 'zod';
import { PASSWORD_MIN_LENGTH, passwordProblem } from '../compute/password';
import { carbBasisSchema, carbUnitSchema, glucoseUnitSchema, preferredFoodTableSchema, timeZoneSchema } from './units';

export const userRoleSchema = z.enum(['member', 'clinician', 'admin']);
export type UserRole = z.infer<typeof userRoleSchema>;

/** How a person reaches a profile: their own, as a carer, or as a clinician. */
export const profileAccessRoleSchema = z.enum(['owner', 'carer', 'clinician']);
export type ProfileAccessRole = z.infer<typeof profileAccessRoleSchema>;

export { PASSWORD_MIN_LENGTH };

/** Extra permissions a grant can carry (carer: settings; clinician: ratios); what each adds is in profile-actions.ts. */
export const grantPermissionSchema = z.enum(['settings', 'ratios']);

/** The colours a profile can wear (names; the theme maps each to its shade), shown beside its name wherever numbers are. */
export const PROFILE_COLOURS = ['teal', 'plum', 'amber', 'sky', 'rose', 'moss'] as const;
export const profileColourSchema = z.enum(PROFILE_COLOURS);
export type ProfileColour = z.infer<typeof profileColourSchema>;

export const emailSchema = z
  .string()
  .trim()
  .min(1, 'Enter your email address.')
  .max(254, 'That email address is too long.')
  .pipe(z.email('Enter a valid email address.'))
  .transform((value) => value.toLowerCase());

/** A new password: the shared rules (shared/compute/password.ts) without the person's own words. */
export const newPasswordSchema = z.string().superRefine((value, ctx) => {
  const problem = passwordProblem(value);
  if (problem) ctx.addIssue({ code: 'custom', message: problem });
});

/** The same rules with the person's e-mail address and name, on the object that holds them. */
function refusePersonal<T extends Record<string, unknown>>(passwordKey: keyof T & string, personalKeys: (keyof T & string)[]) {
  return (value: T, ctx: z.RefinementCtx) => {
    const personal = personalKeys.map((k): unknown => value[k]).filter((v): v is string => typeof v === 'string');
    const password = String(value[passwordKey]);
    // The field's own schema has already reported a problem that does not depend on these words.
    if (passwordProblem(password)) return;
    const problem = passwordProblem(password, personal);
    if (problem) ctx.addIssue({ code: 'custom', path: [passwordKey], message: problem });
  };
}

export const signUpInputSchema = z.object({
  email: emailSchema,
  displayName: z.string().trim().min(1, 'Tell us what to call you.').max(80, 'Use at most 80 characters.'),
  password: newPasswordSchema,
  /** Which food table search shows first; USDA SR28 when not given. */
  preferredFoodTable: preferredFoodTableSchema.optional(),
  /** The browser's time zone (IANA name); UTC when not given. */
  timeZone: timeZoneSchema.optional(),
}).superRefine(refusePersonal('password', ['email', 'displayName']));
export type SignUpInput = z.infer<typeof signUpInputSchema>;

export const signInInputSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

export const changePasswordInputSchema = z
  .object({
    currentPassword: z.string().min(1, 'Enter your current password.').max(200),
    newPassword: newPasswordSchema,
  })
  .refine((v) => v.newPassword !== v.currentPassword, { path: ['newPassword'], message: 'Choose a password different from your current one.' });
export type ChangePasswordInput = z.infer<typeof changePasswordInputSchema>;

export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  role: userRoleSchema,
  createdAt: z.string(),
});
export type User = z.infer<typeof userSchema>;

export const profileSummarySchema = z.object({
  id: z.number().int(),
  displayName: z.string(),
  access: profileAccessRoleSchema,
  /** Extra permissions of this grant (carer: settings; clinician: ratios). */
  permissions: z.array(grantPermissionSchema),
  colour: profileColourSchema,
  /** Kept by a carer for someone without an account. */
  managed: z.boolean(),
  glucoseUnit: glucoseUnitSchema,
  carbBasis: carbBasisSchema,
  carbUnit: carbUnitSchema,
  preferredFoodTable: preferredFoodTableSchema,
  timeZone: z.string(),
});
export type ProfileSummary = z.infer<typeof profileSummarySchema>;

export const meSchema = z.object({
  user: userSchema,
  profiles: z.array(profileSummarySchema),
});
export type Me = z.infer<typeof meSchema>;

export const sessionSchema = z.object({
  token: z.string(),
  expiresAt: z.string(),
  me: meSchema,
});
export type Session = z.infer<typeof sessionSchema>;

/** Ask for a password reset link. */
export const passwordResetRequestInputSchema = z.object({ email: emailSchema });
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestInputSchema>;

/** The token from the reset link and the new password. */
export const passwordResetInputSchema = z.object({
  token: z.string().min(1, 'This link is incomplete. Ask for a new one.').max(200),
  password: newPasswordSchema,
});
export type PasswordResetInput = z.infer<typeof passwordResetInputSchema>;

/** The one answer to a reset request, whether or not an account uses the address. */
export const passwordResetRequestedSchema = z.object({ message: z.string() });

/** Ask to move the account to a new e-mail address: the current password proves it is the owner asking. */
export const emailChangeInputSchema = z.object({
  newEmail: emailSchema,
  currentPassword: z.string().min(1, 'Enter your current password.').max(200),
});
export type EmailChangeInput = z.infer<typeof emailChangeInputSchema>;

/** The token from the link mailed to the new address. */
export const emailChangeConfirmInputSchema = z.object({
  token: z.string().min(1, 'This link is incomplete. Ask for a new one.').max(200),
});
export type EmailChangeConfirmInput = z.infer<typeof emailChangeConfirmInputSchema>;

/** The one answer to a change request, whether or not another account already uses the new address. */
export const emailChangeRequestedSchema = z.object({ message: z.string() });
export type EmailChangeRequested = z.infer<typeof emailChangeRequestedSchema>;
