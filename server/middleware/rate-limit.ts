import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import type { Sequelize } from 'sequelize';
import type { Config } from '../config';
import { AppError } from '../errors';

const TOO_MANY = 'Too many attempts. Please wait a few minutes and try again.';

function limiter(sequelize: Sequelize, keyPrefix: string, points: number, duration: number) {
  return new RateLimiterPostgres({ storeClient: sequelize, storeType: 'sequelize', tableName: 'rate_limits', tableCreated: true, keyPrefix, points, duration });
}

function tooMany(res: Response, rejection: RateLimiterRes): AppError {
  res.set('Retry-After', String(Math.max(1, Math.ceil(rejection.msBeforeNext / 1000))));
  return new AppError(429, 'rate_limited', TOO_MANY);
}

/** Sign-in, sign-up, password and reset throttles, kept in PostgreSQL (table rate_limits) so API processes share them. */
export type AuthLimits = {
  /** Every attempt from one address counts (AUTH_RATE_LIMIT per AUTH_RATE_WINDOW_SECONDS). */
  perAddress: RequestHandler;
  /**
   * Failed sign-ins at one account, from any address (ACCOUNT_RATE_LIMIT per window): once used up, even the right
   * password is refused until the window passes. A success clears the count.
   */
  guardAccount: <T>(email: string, res: Response, attempt: () => Promise<T>) => Promise<T>;
  /** Reset or confirmation mails to one address (MAIL_RATE_LIMIT per hour); true while more may be sent. */
  mayMail: (email: string) => Promise<boolean>;
};

/** Builds the auth throttles on the app's database. */
export function authLimits(config: Config, sequelize: Sequelize): AuthLimits {
  const window = config.AUTH_RATE_WINDOW_SECONDS;
  const address = limiter(sequelize, 'auth-ip', config.AUTH_RATE_LIMIT, window);
  const account = limiter(sequelize, 'auth-account', config.ACCOUNT_RATE_LIMIT, window);
  const mail = limiter(sequelize, 'mail-to', config.MAIL_RATE_LIMIT, 3600);
  return {
    perAddress: (req: Request, res: Response, next: NextFunction) => {
      address
        .consume(req.ip ?? 'unknown')
        .then(() => next())
        .catch((err: unknown) => next(err instanceof RateLimiterRes ? tooMany(res, err) : err));
    },
    guardAccount: async (email, res, attempt) => {
      const seen = await account.get(email);
      if (seen && seen.consumedPoints >= config.ACCOUNT_RATE_LIMIT) throw tooMany(res, seen);
      try {
        const result = await attempt();
        await account.delete(email);
        return result;
      } catch (err) {
        if (err instanceof AppError && err.status === 401) await account.penalty(email, 1);
        throw err;
      }
    },
    mayMail: async (email) => {
      try {
        await mail.consume(email);
        return true;
      } catch (err) {
        if (err instanceof RateLimiterRes) return false;
        throw err;
      }
    },
  };
}
