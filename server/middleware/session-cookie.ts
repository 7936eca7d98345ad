import crypto from 'node:crypto';
import type { CookieOptions, Request, Response } from 'express';
import type { Config } from '../config';

/** The web session: the signed token in an HttpOnly cookie sent only to the API. */
export const SESSION_COOKIE = 'cw_session';
/** The double-submit CSRF token: readable by the page, which echoes it in the header below on every change. */
export const CSRF_COOKIE = 'cw_csrf';
export const CSRF_HEADER = 'x-csrf-token';

const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '::1', '[::1]']);

/** The CSRF token that belongs to a session: an HMAC of its token id, so it cannot be made without the secret. */
export function csrfTokenFor(config: Config, jti: string): string {
  return crypto.createHmac('sha256', config.jwtSecret).update(`csrf:${jti}`).digest('base64url');
}

/** Constant-time comparison of the header against the session's CSRF token. */
export function csrfMatches(config: Config, jti: string, header: string | undefined): boolean {
  const expected = Buffer.from(csrfTokenFor(config, jti));
  const given = Buffer.from(header ?? '');
  return given.length === expected.length && crypto.timingSafeEqual(given, expected);
}

/** One cookie's value from the Cookie header (no cookie parser needed for two names). */
export function readCookie(req: Request, name: string): string | undefined {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return decodeURIComponent(part.slice(eq + 1).trim());
  }
  return undefined;
}

function base(req: Request): CookieOptions {
  // Secure everywhere but loopback, where the app is served over plain http during development and tests.
  return { sameSite: 'strict', secure: req.secure || !LOOPBACK_HOSTS.has(req.hostname) };
}

/** Sets the session and CSRF cookies for a freshly issued token. */
export function setSessionCookies(config: Config, req: Request, res: Response, session: { token: string; expiresAt: string; jti: string }): void {
  const expires = new Date(session.expiresAt);
  res.cookie(SESSION_COOKIE, session.token, { ...base(req), httpOnly: true, path: '/api', expires });
  res.cookie(CSRF_COOKIE, csrfTokenFor(config, session.jti), { ...base(req), httpOnly: false, path: '/', expires });
}

/** Removes both cookies (sign-out). */
export function clearSessionCookies(req: Request, res: Response): void {
  res.clearCookie(SESSION_COOKIE, { ...base(req), httpOnly: true, path: '/api' });
  res.clearCookie(CSRF_COOKIE, { ...base(req), path: '/' });
}

/** Answers with a new session: the cookies for the web app, and the token in the body for API clients. */
export function sendSession(config: Config, req: Request, res: Response, session: { token: string; expiresAt: string }, status = 200): void {
  const { jti } = JSON.parse(Buffer.from(session.token.split('.')[1], 'base64url').toString('utf8')) as { jti: string };
  setSessionCookies(config, req, res, { ...session, jti });
  res.status(status).json(session);
}
