import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { changePasswordInputSchema, signInInputSchema, signUpInputSchema } from '../../shared/schemas/auth';
import type { Config } from '../config';
import { AppError } from '../errors';
import { requireAuth } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { changePassword, getMe, signIn, signOut, signUp } from '../services/auth.service';

/** Sign-up, sign-in, sign-out, password change and /me. */
export function authRouter(config: Config) {
  const router = Router();
  const auth = requireAuth(config);
  const limiter = rateLimit({
    windowMs: config.AUTH_RATE_WINDOW_SECONDS * 1000,
    limit: config.AUTH_RATE_LIMIT,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new AppError(429, 'rate_limited', 'Too many attempts. Please wait a few minutes and try again.')),
  });

  router.post('/auth/sign-up', limiter, validate({ body: signUpInputSchema }), async (req, res) => {
    res.status(201).json(await signUp(config, req.body));
  });
  router.post('/auth/sign-in', limiter, validate({ body: signInInputSchema }), async (req, res) => {
    res.json(await signIn(config, req.body));
  });
  router.post('/auth/sign-out', auth, async (req, res) => {
    await signOut(req.auth!.jti, req.auth!.expiresAt);
    res.status(204).end();
  });
  router.post('/auth/password', auth, limiter, validate({ body: changePasswordInputSchema }), async (req, res) => {
    res.json(await changePassword(config, req.auth!.user, req.body));
  });
  router.get('/me', auth, async (req, res) => {
    res.json(await getMe(req.auth!.user));
  });
  return router;
}
