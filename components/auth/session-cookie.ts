/**
 * The web session lives in an HttpOnly cookie the page cannot read. Beside it the server sets `cw_csrf`, which the
 * page can read: its presence says a session exists, and its value goes back in the `X-CSRF-Token` header on every
 * request that changes something (double submit).
 */
const CSRF_COOKIE = 'cw_csrf';

function cookieJar(): { cookie: string } | undefined {
  return typeof document === 'undefined' ? undefined : document;
}

export const sessionCookie = {
  /** The CSRF token of the current session, or null when signed out. */
  csrf(): string | null {
    const jar = cookieJar();
    if (!jar) return null;
    for (const part of jar.cookie.split(';')) {
      const [name, ...rest] = part.trim().split('=');
      if (name === CSRF_COOKIE && rest.length) return decodeURIComponent(rest.join('='));
    }
    return null;
  },
  /** Forgets the session on this page (after a 401: the server no longer knows it). */
  clear() {
    const jar = cookieJar();
    if (jar) jar.cookie = `${CSRF_COOKIE}=; Max-Age=0; Path=/; SameSite=Strict`;
  },
};
