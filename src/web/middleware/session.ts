import { createHash, randomBytes } from 'node:crypto';
import type { MiddlewareHandler } from 'hono';
import { getCookie, setCookie, deleteCookie } from 'hono/cookie';
import { parseRoles } from '../../auth/roles.ts';
import { nowIso } from '../../clock.ts';
import type { Store } from '../../store/connect.ts';
import type { AppEnv } from '../context.ts';

export const SESSION_COOKIE = 'plumbline_session';
/** A session unused this long ends. */
export const IDLE_TIMEOUT_MS = 8 * 60 * 60 * 1000;
/** A session ends this long after sign-in, however active. */
export const ABSOLUTE_TIMEOUT_MS = 7 * 24 * 60 * 60 * 1000;

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/**
 * Loads the signed-in user from the session cookie. Sessions live in the database (so several
 * app instances share them) under the hash of the cookie value; expired ones are deleted.
 */
export function sessionLoader(): MiddlewareHandler<AppEnv> {
  return async function loadSession(c, next) {
    c.set('user', null);
    const token = getCookie(c, SESSION_COOKIE);
    if (token) {
      const { db } = c.get('store');
      const id = hashToken(token);
      const row = await db
        .selectFrom('sessions')
        .innerJoin('users', 'users.id', 'sessions.user_id')
        .select(['sessions.id', 'sessions.csrf_token', 'sessions.created_at', 'sessions.last_seen_at', 'users.id as user_id', 'users.username', 'users.display_name', 'users.roles', 'users.disabled'])
        .where('sessions.id', '=', id)
        .executeTakeFirst();
      const now = Date.now();
      const expired = row && (now - Date.parse(row.last_seen_at) > IDLE_TIMEOUT_MS || now - Date.parse(row.created_at) > ABSOLUTE_TIMEOUT_MS);
      if (row && !expired && !row.disabled) {
        c.set('user', { id: row.user_id, username: row.username, displayName: row.display_name, roles: parseRoles(row.roles), csrfToken: row.csrf_token });
        if (now - Date.parse(row.last_seen_at) > 60_000) {
          await db.updateTable('sessions').set({ last_seen_at: nowIso() }).where('id', '=', id).execute();
        }
      } else {
        if (row) await db.deleteFrom('sessions').where('id', '=', id).execute();
        deleteCookie(c, SESSION_COOKIE, { path: '/' });
      }
    }
    await next();
  };
}

/** Starts a session for `userId` and sets its cookie. */
export async function startSession(c: Parameters<MiddlewareHandler<AppEnv>>[0], store: Store, userId: number): Promise<void> {
  const token = randomBytes(32).toString('base64url');
  const now = nowIso();
  await store.db
    .insertInto('sessions')
    .values({ id: hashToken(token), user_id: userId, csrf_token: randomBytes(24).toString('base64url'), created_at: now, last_seen_at: now })
    .execute();
  setCookie(c, SESSION_COOKIE, token, { path: '/', httpOnly: true, sameSite: 'Lax', secure: c.get('secureCookies'), maxAge: ABSOLUTE_TIMEOUT_MS / 1000 });
}

/** Ends the current session, in the database and in the browser. */
export async function endSession(c: Parameters<MiddlewareHandler<AppEnv>>[0], store: Store): Promise<void> {
  const token = getCookie(c, SESSION_COOKIE);
  if (token) await store.db.deleteFrom('sessions').where('id', '=', hashToken(token)).execute();
  deleteCookie(c, SESSION_COOKIE, { path: '/' });
}
