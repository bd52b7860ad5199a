import type { MiddlewareHandler } from 'hono';
import { HttpError } from '../../errors.ts';
import { findLiveToken, type TokenScope } from '../../store/repos/api-tokens.ts';
import type { AppEnv } from '../context.ts';

export interface RateLimit {
  requests: number;
  perMs: number;
}

/**
 * Authenticates an API request by its bearer token and checks the token's scope and rate. The
 * rate window is kept in this process's memory (each app instance counts its own requests).
 *
 * @example
 * app.post('/api/v1/batches', requireToken('import'), handler)
 */
export function requireToken(scope: TokenScope, limit: RateLimit = { requests: 60, perMs: 60_000 }): MiddlewareHandler<AppEnv> {
  const recent = new Map<number, number[]>();
  return async function checkToken(c, next) {
    const header = c.req.header('authorization') ?? '';
    const match = header.match(/^Bearer\s+(\S+)$/i);
    if (!match) throw new HttpError(401, 'Send an API token as "Authorization: Bearer <token>". An admin creates tokens on the API tokens page.');
    const token = await findLiveToken(c.get('store').db, match[1]);
    if (!token) throw new HttpError(401, 'This API token is unknown or revoked. Ask an admin for a new one.');
    if (!token.scopes.includes(scope)) throw new HttpError(403, `This token may not ${scope}; its scopes are: ${token.scopes.join(', ') || 'none'}. Ask an admin for a token with the "${scope}" scope.`);
    const now = Date.now();
    const times = (recent.get(token.id) ?? []).filter((t) => now - t < limit.perMs);
    if (times.length >= limit.requests) {
      c.header('Retry-After', String(Math.ceil((limit.perMs - (now - times[0])) / 1000)));
      throw new HttpError(429, `This token has made ${limit.requests} requests in the last ${limit.perMs / 1000} seconds. Wait and try again.`);
    }
    times.push(now);
    recent.set(token.id, times);
    c.set('apiToken', token);
    return next();
  };
}
