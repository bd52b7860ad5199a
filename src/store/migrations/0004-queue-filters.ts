import type { Kysely } from 'kysely';
import { delimited } from '../delimited-list.ts';

/**
 * Queue filters and a per-batch rationale minimum:
 * - `items.score_bands` and `items.finding_checks` summarise an item's scores as
 *   comma-delimited lists (",fail,pass,"), so the queue filters by band and by check without
 *   reading every finding; items scored before this migration are filled in from their scores;
 * - `batches.rationale_min`, the characters a reviewer's rationale needs (20 before);
 * - `batches.import_owner` and `import_heartbeat_at`, set while an import stores a batch in
 *   steps (its items `staged`), so that an import cut short can be found and removed;
 * - an index in the queue's exact order within a state, so a page of the queue reads 50 index
 *   entries instead of sorting every waiting item.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('items').addColumn('score_bands', 'text').execute();
  await db.schema.alterTable('items').addColumn('finding_checks', 'text').execute();
  await db.schema.alterTable('batches').addColumn('rationale_min', 'integer', (c) => c.notNull().defaultTo(20)).execute();
  await db.schema.alterTable('batches').addColumn('import_owner', 'text').execute();
  await db.schema.alterTable('batches').addColumn('import_heartbeat_at', 'text').execute();
  await db.schema.createIndex('items_queue_page').on('items').columns(['state', 'priority desc', 'created_at', 'id']).execute();
  const rows = await db
    .selectFrom('scores')
    .innerJoin('responses', 'responses.id', 'scores.response_id')
    .select(['responses.item_id', 'scores.band', 'scores.findings'])
    .orderBy('responses.item_id')
    .execute();
  const byItem = new Map<number, { bands: Set<string>; checks: Set<string> }>();
  for (const row of rows) {
    let entry = byItem.get(row.item_id);
    if (!entry) byItem.set(row.item_id, (entry = { bands: new Set(), checks: new Set() }));
    entry.bands.add(row.band);
    for (const f of JSON.parse(row.findings) as { check: string }[]) entry.checks.add(f.check);
  }
  for (const [itemId, { bands, checks }] of byItem) {
    await db.updateTable('items').set({ score_bands: delimited(bands), finding_checks: delimited(checks) }).where('id', '=', itemId).execute();
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('items_queue_page').execute();
  await db.schema.alterTable('batches').dropColumn('import_heartbeat_at').execute();
  await db.schema.alterTable('batches').dropColumn('import_owner').execute();
  await db.schema.alterTable('batches').dropColumn('rationale_min').execute();
  await db.schema.alterTable('items').dropColumn('finding_checks').execute();
  await db.schema.alterTable('items').dropColumn('score_bands').execute();
}
