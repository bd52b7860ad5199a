import type { Kysely } from 'kysely';
import type { Database } from '../schema.ts';

export async function getSetting(db: Kysely<Database>, key: string): Promise<string | undefined> {
  const row = await db.selectFrom('settings').select('value').where('key', '=', key).executeTakeFirst();
  return row?.value;
}

/**
 * Stores `value` under `key` only if the key is still unset; returns true when this call set it.
 * Two processes racing to seed the same database cannot both win.
 */
export async function setSettingOnce(db: Kysely<Database>, key: string, value: string): Promise<boolean> {
  const result = await db
    .insertInto('settings')
    .values({ key, value })
    .onConflict((oc) => oc.column('key').doNothing())
    .executeTakeFirst();
  return Number(result.numInsertedOrUpdatedRows ?? 0) > 0;
}
