import type { Kysely } from 'kysely';
import type { Database } from '../store/schema.ts';

/** Failed sign-ins counted over this window. */
export const THROTTLE_WINDOW_MS = 15 * 60 * 1000;
/** Failures for one account within the window before it is paused. */
export const MAX_FAILURES_PER_ACCOUNT = 5;
/** Failures from one address within the window before it is paused. */
export const MAX_FAILURES_PER_ADDRESS = 20;

/**
 * Whether sign-in is paused for this account or address, and for how long. Failures live in the
 * database, so every app instance sees the same count.
 */
export async function signInPause(db: Kysely<Database>, username: string, address: string, now = Date.now()): Promise<{ minutes: number; reason: 'account' | 'address' } | null> {
  const since = new Date(now - THROTTLE_WINDOW_MS).toISOString();
  for (const [reason, column, value, limit] of [['account', 'username', username, MAX_FAILURES_PER_ACCOUNT], ['address', 'address', address, MAX_FAILURES_PER_ADDRESS]] as const) {
    const rows = await db.selectFrom('login_failures').select('at').where(column, '=', value).where('at', '>', since).orderBy('at', 'asc').execute();
    if (rows.length >= limit) {
      const oldestCounted = Date.parse(rows[rows.length - limit].at);
      return { minutes: Math.max(1, Math.ceil((oldestCounted + THROTTLE_WINDOW_MS - now) / 60_000)), reason };
    }
  }
  return null;
}

/** Records a failed sign-in (and forgets failures older than a day). */
export async function recordSignInFailure(db: Kysely<Database>, username: string, address: string): Promise<void> {
  await db.insertInto('login_failures').values({ at: new Date().toISOString(), username, address }).execute();
  await db.deleteFrom('login_failures').where('at', '<', new Date(Date.now() - 24 * 60 * 60 * 1000).toISOString()).execute();
}
