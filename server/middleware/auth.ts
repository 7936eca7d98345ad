import type { NextFunction, Request, Response } from 'express';
import type { UserRole } from '../../shared/schemas/auth';
import { profileActionAllowed, type ProfileAction } from '../../shared/schemas/profile-actions';
import { AppError } from '../errors';
import { rememberValue } from '../lib/request-cache';
import { findProfileAccess, verifyToken, type ProfileAccess, type SignedInUser } from '../services/auth.service';
import { profileUnits, type ProfileUnits } from '../services/profiles.service';
import type { Config } from '../config';

export type AuthContext = { user: SignedInUser; jti: string; expiresAt: Date };

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthContext;
    profileAccess?: ProfileAccess;
    /** Set by requireAuth when the path names a profile: the access found with the sign-in check (null: none). */
    checkedAccess?: { profileId: number; access: ProfileAccess | null };
  }
}

const profileIdOf = (req: Request, param: string) => {
  const id = Number(req.params[param]);
  return Number.isInteger(id) && id > 0 ? id : undefined;
};

/**
 * Requires a valid bearer token; sets req.auth. When the path names a profile, the access to it is read in the same
 * query, so requireProfileAccess needs no second round trip.
 */
export function requireAuth(config: Config, param = 'profileId') {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const header = req.get('authorization') ?? '';
    const match = /^Bearer\s+(.+)$/i.exec(header);
    if (!match) return next(AppError.unauthorized());
    const profileId = profileIdOf(req, param);
    const { auth, access } = await verifyToken(config, match[1].trim(), profileId);
    req.auth = auth;
    rememberValue(`user:${auth.user.id}`, auth.user);
    if (profileId !== undefined) {
      req.checkedAccess = { profileId, access };
      if (access) rememberValue<ProfileUnits>(`profile-units:${profileId}`, access.profile);
    }
    next();
  };
}

/** Allows only the given account roles (after requireAuth). */
export function requireRole(...roles: UserRole[]) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.auth) return next(AppError.unauthorized());
    if (!roles.includes(req.auth.user.role)) return next(AppError.forbidden());
    next();
  };
}

/**
 * Allows only people whose access to the profile named by req.params[param] allows the named action (after requireAuth).
 * Without access the answer is 404, so strangers cannot learn which profiles exist.
 */
export function requireProfileAccess(action: ProfileAction, param = 'profileId') {
  return async (req: Request, _res: Response, next: NextFunction) => {
    if (!req.auth) return next(AppError.unauthorized());
    const profileId = profileIdOf(req, param);
    if (profileId === undefined) return next(AppError.validation({ [param]: ['Not a valid id.'] }));
    const access =
      req.checkedAccess?.profileId === profileId ? req.checkedAccess.access : await accessFromTable(req.auth.user.id, profileId);
    if (!access) return next(AppError.notFound('profile'));
    if (!profileActionAllowed(access, action)) return next(AppError.forbidden('Your access to this profile does not allow that.'));
    req.profileAccess = access;
    next();
  };
}

async function accessFromTable(userId: number, profileId: number): Promise<ProfileAccess | null> {
  const row = await findProfileAccess(userId, profileId);
  if (!row) return null;
  const permissions = (row as { permissions?: ProfileAccess['permissions'] }).permissions ?? null;
  return { profileId, role: row.role, permissions, profile: await profileUnits(profileId) };
}
