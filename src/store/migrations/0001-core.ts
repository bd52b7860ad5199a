import type { Kysely } from 'kysely';
import { withId } from './column-helpers.ts';

/** Batches, items and responses; rubric versions and scores; users, sessions, audit, settings. */
export async function up(db: Kysely<unknown>): Promise<void> {
  await withId(db, db.schema.createTable('users'))
    .addColumn('username', 'text', (c) => c.notNull().unique())
    .addColumn('display_name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text', (c) => c.notNull())
    .addColumn('roles', 'text', (c) => c.notNull())
    .addColumn('disabled', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('sessions')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('csrf_token', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('last_seen_at', 'text', (c) => c.notNull())
    .execute();

  await withId(db, db.schema.createTable('batches'))
    .addColumn('name', 'text', (c) => c.notNull().unique())
    .addColumn('source_hash', 'text', (c) => c.notNull().unique())
    .addColumn('source_name', 'text', (c) => c.notNull())
    .addColumn('reviews_required', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('blind_first', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('consensus_rule', 'text', (c) => c.notNull())
    .addColumn('rubric_id', 'text')
    .addColumn('created_by', 'integer', (c) => c.references('users.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await withId(db, db.schema.createTable('items'))
    .addColumn('batch_id', 'integer', (c) => c.notNull().references('batches.id').onDelete('cascade'))
    .addColumn('prompt_id', 'text', (c) => c.notNull())
    .addColumn('prompt', 'text', (c) => c.notNull())
    .addColumn('flag_reason', 'text')
    .addColumn('flag_severity', 'text')
    .addColumn('meta', 'text')
    .addColumn('state', 'text', (c) => c.notNull().defaultTo('open'))
    .addColumn('priority', 'real', (c) => c.notNull().defaultTo(0))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('items_batch_prompt_unique', ['batch_id', 'prompt_id'])
    .execute();
  await db.schema.createIndex('items_queue_order').on('items').columns(['state', 'priority', 'created_at']).execute();

  await withId(db, db.schema.createTable('responses'))
    .addColumn('item_id', 'integer', (c) => c.notNull().references('items.id').onDelete('cascade'))
    .addColumn('response_id', 'text', (c) => c.notNull())
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('position', 'integer', (c) => c.notNull())
    .addUniqueConstraint('responses_item_response_unique', ['item_id', 'response_id'])
    .execute();

  await withId(db, db.schema.createTable('rubric_versions'))
    .addColumn('rubric_id', 'text', (c) => c.notNull())
    .addColumn('version', 'text', (c) => c.notNull())
    .addColumn('content', 'text', (c) => c.notNull())
    .addColumn('author_id', 'integer', (c) => c.references('users.id'))
    .addColumn('note', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('rubric_versions_unique', ['rubric_id', 'version'])
    .execute();

  await withId(db, db.schema.createTable('scores'))
    .addColumn('response_id', 'integer', (c) => c.notNull().references('responses.id').onDelete('cascade'))
    .addColumn('rubric_id', 'text', (c) => c.notNull())
    .addColumn('rubric_version', 'text', (c) => c.notNull())
    .addColumn('overall', 'real', (c) => c.notNull())
    .addColumn('band', 'text', (c) => c.notNull())
    .addColumn('suggested_rank', 'integer', (c) => c.notNull())
    .addColumn('criteria', 'text', (c) => c.notNull())
    .addColumn('findings', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('scores_response_version_unique', ['response_id', 'rubric_version'])
    .execute();

  await withId(db, db.schema.createTable('audit_events'))
    .addColumn('at', 'text', (c) => c.notNull())
    .addColumn('actor_id', 'integer', (c) => c.references('users.id'))
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('subject', 'text')
    .addColumn('detail', 'text')
    .execute();
  await db.schema.createIndex('audit_events_at').on('audit_events').column('at').execute();

  await db.schema
    .createTable('settings')
    .addColumn('key', 'text', (c) => c.primaryKey())
    .addColumn('value', 'text', (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const table of ['settings', 'audit_events', 'scores', 'rubric_versions', 'responses', 'items', 'batches', 'sessions', 'users']) {
    await db.schema.dropTable(table).execute();
  }
}
