import type { NextFunction, Request, Response } from 'express';
import type { UserRole } from '../../shared/schemas/auth';
import { profileActionAllowed, type ProfileAction } from '../../shared/schemas/profile-actions';
import { AppError } from '../errors';
import type { ProfileAccessModel, UserModel } from '../models';
import { findProfileAccess, verifyToken } from '../services/auth.service';
import type { Config } from '../config';
import { csrfMatches, CSRF_HEADER, readCookie, SESSION_COOKIE } from './session-cookie';

export type AuthContext = { user: UserModel; jti: string; expiresAt: Date };

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthContext;
    profileAccess?: ProfileAccessModel;
  }
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Requires a valid session: a bearer token (API clients, tests) or the web app's session cookie. A request that
 * changes something on the strength of the cookie must also carry the CSRF header (double submit), or it gets 403.
 */
export function requireAuth(config: Config) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const match = /^Bearer\s+(.+)$/i.exec(req.get('authorization') ?? '');
    const cookie = match ? undefined : readCookie(req, SESSION_COOKIE);
    const token = match?.[1].trim() ?? cookie;
    if (!token) return next(AppError.unauthorized());
    req.auth = await verifyToken(config, token);
    if (cookie && !SAFE_METHODS.has(req.method) && !csrfMatches(config, req.auth.jti, req.get(CSRF_HEADER))) {
      return next(AppError.forbidden('This request did not come from the Carbwright page. Reload the page and try again.'));
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
    const profileId = Number(req.params[param]);
    if (!Number.isInteger(profileId) || profileId <= 0) {
      return next(AppError.validation({ [param]: ['Not a valid id.'] }));
    }
    const access = await findProfileAccess(req.auth.user.id, profileId);
    if (!access) return next(AppError.notFound('profile'));
    if (!profileActionAllowed(access, action)) return next(AppError.forbidden('Your access to this profile does not allow that.'));
    req.profileAccess = access;
    next();
  };
}
