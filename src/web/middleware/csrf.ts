import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { MiddlewareHandler } from 'hono';
import { getCookie, setCookie } from 'hono/cookie';
import { HttpError } from '../../errors.ts';
import type { AppEnv } from '../context.ts';

export const CSRF_COOKIE = 'plumbline_csrf';
export const CSRF_HEADER = 'x-csrf-token';
export const CSRF_FIELD = '_csrf';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Protects every state-changing request. The Origin (or Referer) must be this site, and the
 * request must carry the token: the session's token when signed in, otherwise the value of a
 * pre-session cookie (double submit), in the `x-csrf-token` header (htmx) or the `_csrf` field
 * (plain forms). API routes that authenticate with a bearer token are exempt, since a browser
 * never attaches that token on its own.
 */
export function csrfProtection(options: { exempt?: (path: string) => boolean } = {}): MiddlewareHandler<AppEnv> {
  return async function checkCsrf(c, next) {
    const user = c.get('user');
    let token = user?.csrfToken;
    if (!token) {
      token = getCookie(c, CSRF_COOKIE);
      if (!token) {
        token = randomBytes(24).toString('base64url');
        setCookie(c, CSRF_COOKIE, token, { path: '/', httpOnly: true, sameSite: 'Lax', secure: c.get('secureCookies') });
      }
    }
    c.set('csrfToken', token);
    if (SAFE_METHODS.has(c.req.method) || options.exempt?.(c.req.path)) return next();

    if (!sameOrigin(c.req.header('origin') ?? c.req.header('referer'), c.req.url)) {
      throw new HttpError(403, 'This request came from another site and was refused. Reload the page and try again.');
    }
    let sent = c.req.header(CSRF_HEADER);
    if (!sent) {
      const type = c.req.header('content-type') ?? '';
      if (type.startsWith('application/x-www-form-urlencoded') || type.startsWith('multipart/form-data')) {
        const body = await c.req.parseBody();
        const field = body[CSRF_FIELD];
        sent = typeof field === 'string' ? field : undefined;
      }
    }
    if (!sent || !equal(sent, token)) {
      throw new HttpError(403, 'The form had expired or lacked its security token. Reload the page and submit again.');
    }
    return next();
  };
}

function sameOrigin(source: string | undefined, requestUrl: string): boolean {
  if (!source) return false;
  try {
    return new URL(source).origin === new URL(requestUrl).origin;
  } catch {
    return false;
  }
}

function equal(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}
