import type { Kysely } from 'kysely';
import type { Database } from '../store/schema.ts';

/** Items a reviewer may review in a day before Plumbline suggests a break (soft: they may go on). */
export const DEFAULT_DAILY_SOFT_LIMIT = 120;

/** The soft limit from PLUMBLINE_DAILY_LIMIT, or the default. */
export function dailySoftLimit(env: NodeJS.ProcessEnv = process.env): number {
  const n = Number(env.PLUMBLINE_DAILY_LIMIT);
  return Number.isInteger(n) && n > 0 ? n : DEFAULT_DAILY_SOFT_LIMIT;
}

/** Items this reviewer submitted or escalated today (UTC); skips are not counted against anyone. */
export async function reviewedToday(db: Kysely<Database>, userId: number, now = new Date()): Promise<number> {
  const day = now.toISOString().slice(0, 10);
  const row = await db
    .selectFrom('reviews')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('reviewer_id', '=', userId)
    .where('status', 'in', ['submitted', 'escalated'])
    .where('submitted_at', '>=', `${day}T00:00:00.000Z`)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}
