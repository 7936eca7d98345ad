import { z } from 'zod';
import { carbBasisSchema, carbUnitSchema, glucoseUnitSchema, preferredFoodTableSchema } from './units';

export const userRoleSchema = z.enum(['member', 'clinician', 'admin']);
export type UserRole = z.infer<typeof userRoleSchema>;

/** How a person reaches a profile: their own, as a carer, or as a clinician. */
export const profileAccessRoleSchema = z.enum(['owner', 'carer', 'clinician']);
export type ProfileAccessRole = z.infer<typeof profileAccessRoleSchema>;

/** Extra permissions a grant can carry (carer: settings; clinician: ratios); what each adds is in profile-actions.ts. */
export const grantPermissionSchema = z.enum(['settings', 'ratios']);

/** The colours a profile can wear (names; the theme maps each to its shade), shown beside its name wherever numbers are. */
export const PROFILE_COLOURS = ['teal', 'plum', 'amber', 'sky', 'rose', 'moss'] as const;
export const profileColourSchema = z.enum(PROFILE_COLOURS);
export type ProfileColour = z.infer<typeof profileColourSchema>;

export const PASSWORD_MIN_LENGTH = 10;

const emailSchema = z
  .string()
  .trim()
  .min(1, 'Enter your email address.')
  .max(254, 'That email address is too long.')
  .pipe(z.email('Enter a valid email address.'))
  .transform((value) => value.toLowerCase());

const newPasswordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(200, 'Use at most 200 characters.');

export const signUpInputSchema = z.object({
  email: emailSchema,
  displayName: z.string().trim().min(1, 'Tell us what to call you.').max(80, 'Use at most 80 characters.'),
  password: newPasswordSchema,
  /** Which food table search shows first; USDA SR28 when not given. */
  preferredFoodTable: preferredFoodTableSchema.optional(),
});
export type SignUpInput = z.infer<typeof signUpInputSchema>;

export const signInInputSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

export const changePasswordInputSchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password.').max(200),
  newPassword: newPasswordSchema,
});
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
