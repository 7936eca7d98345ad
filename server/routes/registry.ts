import type { Request, RequestHandler, Response, Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { z } from 'zod';
import type { UserRole } from '../../shared/schemas/auth';
import type { ProfileAction } from '../../shared/schemas/profile-actions';
import type { Config } from '../config';
import type { PhotoProcessor } from '../lib/photo-worker';
import type { FileStorage } from '../lib/storage';
import { requireAuth, requireProfileAccess, requireRole, type AuthContext } from '../middleware/auth';
import { validate, type RequestSchemas, type ValidatedInput } from '../middleware/validate';

/** What every route file may use: built once in createApp. */
export type AppDeps = { config: Config; sequelize: Sequelize; storage: FileStorage; photos: PhotoProcessor };

/** Who may call a route. */
export type Access =
  | { kind: 'public' }
  | { kind: 'signed-link' }
  | { kind: 'signed-in' }
  | { kind: 'role'; roles: UserRole[] }
  | { kind: 'profile'; action: ProfileAction };

/** The access levels, named once: `access.profile('log.write')` (actions in shared/schemas/profile-actions.ts). */
export const access = {
  public: { kind: 'public' } as Access,
  /** No bearer token: a short-lived HMAC-signed link (photos in `<img>`). */
  signedLink: { kind: 'signed-link' } as Access,
  signedIn: { kind: 'signed-in' } as Access,
  role: (...roles: UserRole[]): Access => ({ kind: 'role', roles }),
  /** Needs `:profileId` in the path; without access the answer is 404, with access that does not allow the action 403. */
  profile: (action: ProfileAction): Access => ({ kind: 'profile', action }),
};

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

type Maybe = z.ZodType | undefined;
type Parsed<T extends Maybe> = [T] extends [z.ZodType] ? z.output<T> : undefined;

/** What a handler gets: the parsed request parts, typed by the route's schemas, and the signed-in user. */
export type RouteContext<P extends Maybe, Q extends Maybe, B extends Maybe> = {
  params: Parsed<P>;
  query: Parsed<Q>;
  body: Parsed<B>;
  /** The signed-in user's id and role (routes other than public and signed-link always have one). */
  user: { id: number; role: UserRole };
  auth: AuthContext;
};

export type RouteDef<P extends Maybe = undefined, Q extends Maybe = undefined, B extends Maybe = undefined> = {
  params?: P;
  query?: Q;
  body?: B;
  method: Method;
  /** Express path under /api, e.g. `/recipes/:id`. */
  path: string;
  summary: string;
  access: Access;
  /** The success status and its body schema (a zod schema from shared/schemas), when there is one. */
  status?: number;
  response?: z.ZodType;
  /** Request body format when not JSON (documented in OpenAPI; parsed by `before`). */
  bodyFormat?: 'multipart';
  /** Middleware that runs after the access check and before validation (rate limit, upload parsing). */
  before?: RequestHandler[];
  /** Mounted only when this answers true (e.g. bench routes). */
  enabled?: (config: Config) => boolean;
  handler: (ctx: RouteContext<P, Q, B>, req: Request, res: Response) => Promise<unknown> | unknown;
};

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type AnyRoute = RouteDef<any, any, any>;

/** Declares one route; the schemas type the handler's ctx. Add it to its file's list and it is mounted and documented. */
export function defineRoute<P extends Maybe = undefined, Q extends Maybe = undefined, B extends Maybe = undefined>(def: RouteDef<P, Q, B>): AnyRoute {
  return def as AnyRoute;
}

function accessChain(a: Access, config: Config): RequestHandler[] {
  switch (a.kind) {
    case 'public':
    case 'signed-link':
      return [];
    case 'signed-in':
      return [requireAuth(config)];
    case 'role':
      return [requireAuth(config), requireRole(...a.roles)];
    case 'profile':
      return [requireAuth(config), requireProfileAccess(a.action)];
  }
}

/** The routes that are on for this config. */
export function enabledRoutes(routes: AnyRoute[], config: Config): AnyRoute[] {
  return routes.filter((r) => !r.enabled || r.enabled(config));
}

/** Mounts every enabled route on the router: access check, `before`, validate, then the typed handler. */
export function mountRoutes(router: Router, routes: AnyRoute[], config: Config): void {
  for (const route of enabledRoutes(routes, config)) {
    const { params, query, body } = route;
    router[route.method](route.path, ...accessChain(route.access, config), ...(route.before ?? []), validate({ params, query, body }), async (req, res) => {
      const input = res.locals.input as ValidatedInput<RequestSchemas>;
      // Public and signed-link handlers get no user; every other access kind has passed requireAuth.
      const user = req.auth ? { id: req.auth.user.id, role: req.auth.user.role } : undefined;
      await route.handler({ ...input, user: user!, auth: req.auth! }, req, res);
    });
  }
}
