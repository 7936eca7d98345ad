import type { NextFunction, Request, Response } from 'express';
import type { UserRole } from '../../shared/schemas/auth';
import { profileActionAllowed, type ProfileAction } from '../../shared/schemas/profile-actions';
import { AppError } from '../errors';
import { rememberValue } from '../lib/request-cache';
import { findProfileAccess, verifyToken, type ProfileAccess, type SignedInUser } from '../services/auth.service';
import { profileUnits, type ProfileUnits } from '../services/profiles.service';
import type { Config } from '../config';
import { csrfMatches, CSRF_HEADER, readCookie, SESSION_COOKIE } from './session-cookie';

export type AuthContext = { user: SignedInUser; jti: string; expiresAt: Date };

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthContext;
    profileAccess?: ProfileAccess;
    /** Set by requireAuth when the path names a profile: the access found with the sign-in check (null: none). */
    checkedAccess?: { profileId: number; access: ProfileAccess | null };
  }
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

const profileIdOf = (req: Request, param: string) => {
  const id = Number(req.params[param]);
  return Number.isInteger(id) && id > 0 ? id : undefined;
};

/**
 * Requires a valid session: a bearer token (API clients, tests) or the web app's session cookie. A request that
 * changes something on the strength of the cookie must also carry the CSRF header (double submit), or it gets 403.
 * When the path names a profile, the access to it is read in the same query, so requireProfileAccess needs no second
 * round trip.
 */
export function requireAuth(config: Config, param = 'profileId') {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const match = /^Bearer\s+(.+)$/i.exec(req.get('authorization') ?? '');
    const cookie = match ? undefined : readCookie(req, SESSION_COOKIE);
    const token = match?.[1].trim() ?? cookie;
    if (!token) return next(AppError.unauthorized());
    const profileId = profileIdOf(req, param);
    const { auth, access } = await verifyToken(config, token, profileId);
    req.auth = auth;
    if (cookie && !SAFE_METHODS.has(req.method) && !csrfMatches(config, auth.jti, req.get(CSRF_HEADER))) {
      return next(AppError.forbidden('This request did not come from the Carbwright page. Reload the page and try again.'));
    }
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
