import type { Kysely } from 'kysely';
import { withId } from './column-helpers.ts';

/** Reviews, work claims, adjudications (final decisions) and API tokens. */
export async function up(db: Kysely<unknown>): Promise<void> {
  await withId(db, db.schema.createTable('reviews'))
    .addColumn('item_id', 'integer', (c) => c.notNull().references('items.id').onDelete('cascade'))
    .addColumn('reviewer_id', 'integer', (c) => c.notNull().references('users.id'))
    .addColumn('status', 'text', (c) => c.notNull())
    .addColumn('display_order', 'text', (c) => c.notNull())
    .addColumn('first_ranking', 'text')
    .addColumn('final_ranking', 'text')
    .addColumn('rationale', 'text')
    .addColumn('reason', 'text')
    .addColumn('rubric_version', 'text')
    .addColumn('started_at', 'text', (c) => c.notNull())
    .addColumn('revealed_at', 'text')
    .addColumn('submitted_at', 'text', (c) => c.notNull())
    .addColumn('time_spent_ms', 'integer', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('reviews_item').on('reviews').column('item_id').execute();
  await db.schema.createIndex('reviews_reviewer').on('reviews').columns(['reviewer_id', 'submitted_at']).execute();

  await withId(db, db.schema.createTable('work_claims'))
    .addColumn('item_id', 'integer', (c) => c.notNull().references('items.id').onDelete('cascade'))
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id'))
    .addColumn('claimed_at', 'text', (c) => c.notNull())
    .addColumn('expires_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('work_claims_item_user_unique', ['item_id', 'user_id'])
    .execute();

  await withId(db, db.schema.createTable('adjudications'))
    .addColumn('item_id', 'integer', (c) => c.notNull().unique().references('items.id').onDelete('cascade'))
    .addColumn('adjudicator_id', 'integer', (c) => c.references('users.id'))
    .addColumn('method', 'text', (c) => c.notNull())
    .addColumn('ranking', 'text', (c) => c.notNull())
    .addColumn('rationale', 'text')
    .addColumn('rubric_version', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await withId(db, db.schema.createTable('api_tokens'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('scopes', 'text', (c) => c.notNull())
    .addColumn('created_by', 'integer', (c) => c.references('users.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('revoked_at', 'text')
    .addColumn('last_used_at', 'text')
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const table of ['api_tokens', 'adjudications', 'work_claims', 'reviews']) {
    await db.schema.dropTable(table).execute();
  }
}
