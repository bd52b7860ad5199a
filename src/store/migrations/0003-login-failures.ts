import type { Kysely } from 'kysely';
import { withId } from './column-helpers.ts';

/** Failed sign-ins, for throttling per account and per address across app instances. */
export async function up(db: Kysely<unknown>): Promise<void> {
  await withId(db, db.schema.createTable('login_failures'))
    .addColumn('at', 'text', (c) => c.notNull())
    .addColumn('username', 'text', (c) => c.notNull())
    .addColumn('address', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('login_failures_username').on('login_failures').columns(['username', 'at']).execute();
  await db.schema.createIndex('login_failures_address').on('login_failures').columns(['address', 'at']).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('login_failures').execute();
}
