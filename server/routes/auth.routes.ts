import { rateLimit } from 'express-rate-limit';
import { changePasswordInputSchema, meSchema, sessionSchema, signInInputSchema, signUpInputSchema } from '../../shared/schemas/auth';
import { AppError } from '../errors';
import { changePassword, getMe, signIn, signOut, signUp } from '../services/auth.service';
import { access, defineRoute, type AnyRoute, type AppDeps } from './registry';

/** Sign-up, sign-in, sign-out, password change and /me. */
export function authRoutes({ config }: AppDeps): AnyRoute[] {
  const limiter = rateLimit({
    windowMs: config.AUTH_RATE_WINDOW_SECONDS * 1000,
    limit: config.AUTH_RATE_LIMIT,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new AppError(429, 'rate_limited', 'Too many attempts. Please wait a few minutes and try again.')),
  });
  return [
    defineRoute({
      method: 'post', path: '/auth/sign-up', access: access.public, before: [limiter], body: signUpInputSchema, status: 201, response: sessionSchema,
      summary: 'Create an account (rate-limited): a member also gets their own profile. 409 when the email is taken.',
      handler: async ({ body }, _req, res) => res.status(201).json(await signUp(config, body)),
    }),
    defineRoute({
      method: 'post', path: '/auth/sign-in', access: access.public, before: [limiter], body: signInInputSchema, response: sessionSchema,
      summary: 'Sign in (rate-limited); the same 401 for an unknown email or a wrong password.',
      handler: async ({ body }, _req, res) => res.json(await signIn(config, body)),
    }),
    defineRoute({
      method: 'post', path: '/auth/sign-out', access: access.signedIn, status: 204, summary: 'Revoke this token.',
      handler: async ({ auth }, _req, res) => {
        await signOut(auth.jti, auth.expiresAt);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post', path: '/auth/password', access: access.signedIn, before: [limiter], body: changePasswordInputSchema, response: sessionSchema,
      summary: 'Change the password (rate-limited) and get a new session; older tokens stop working.',
      handler: async ({ user, body }, _req, res) => res.json(await changePassword(config, user.id, body)),
    }),
    defineRoute({
      method: 'get', path: '/me', access: access.signedIn, response: meSchema, summary: 'The signed-in account and the profiles it may open.',
      handler: async ({ auth }, _req, res) => {
        const { tokenVersion: _tv, ...user } = auth.user;
        res.json(await getMe(user.id, user));
      },
    }),
  ];
}
