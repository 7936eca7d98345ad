import type { ProfileAccessRole } from './auth';

/**
 * What someone may do on a profile, by name. Every profile route names the action it needs; the roles below are the
 * default for each grant, and a grant's extra permissions (carer: settings; clinician: ratios) widen it.
 */
export const PROFILE_ACTIONS = {
  /** Units, safety limits, day kinds, dates, history: read. */
  'profile.read': ['owner', 'carer', 'clinician'],
  /** Units, safety limits, active-insulin model: the owner; a carer with the settings permission. */
  'settings.write': ['owner'],
  /**
   * Day kinds, their times of day (ratios, correction factors) and which date is which kind: the owner; a carer with
   * the settings permission (ratios are dose settings too); a clinician with the ratios permission.
   */
  'ratios.write': ['owner'],
  /** Batches, portions, containers, labels: read. */
  'kitchen.read': ['owner', 'carer', 'clinician'],
  /** Cook, portion out, move, throw away. */
  'kitchen.write': ['owner', 'carer'],
  /** Work out a dose (answers only; nothing is written). */
  'dose.check': ['owner', 'carer', 'clinician'],
  /** The logbook: meals, readings, doses, exercise. */
  'log.read': ['owner', 'carer', 'clinician'],
  'log.write': ['owner', 'carer'],
  /** The week plan: meals, planned cooks, weekly pattern, shopping list. */
  'plan.read': ['owner', 'carer', 'clinician'],
  'plan.write': ['owner', 'carer'],
  /** Who has access: invite, change, revoke. */
  'access.manage': ['owner'],
} as const satisfies Record<string, readonly ProfileAccessRole[]>;

export type ProfileAction = keyof typeof PROFILE_ACTIONS;

/** A grant's extra permissions and the actions each one adds. */
export const GRANT_PERMISSIONS = {
  settings: ['settings.write', 'ratios.write'],
  ratios: ['ratios.write'],
} as const satisfies Record<string, readonly ProfileAction[]>;

export type GrantPermission = keyof typeof GRANT_PERMISSIONS;

/** True when a grant (its role and extra permissions) allows the action. */
export function profileActionAllowed(
  grant: { role: ProfileAccessRole; permissions?: readonly GrantPermission[] | null },
  action: ProfileAction,
): boolean {
  if ((PROFILE_ACTIONS[action] as readonly ProfileAccessRole[]).includes(grant.role)) return true;
  return (grant.permissions ?? []).some((p) => (GRANT_PERMISSIONS[p] as readonly ProfileAction[]).includes(action));
}
