import type { Kysely, Transaction } from 'kysely';
import { nowIso } from '../../clock.ts';
import { UserError } from '../../errors.ts';
import type { Batch, Database, ItemState } from '../schema.ts';
import { recordAudit } from './audit.ts';

export interface NewResponse {
  responseId: string;
  text: string;
}

export interface NewItem {
  promptId: string;
  prompt: string;
  flag?: { reason: string; severity: string } | null;
  meta?: Record<string, unknown> | null;
  responses: NewResponse[];
  priority?: number;
}

export interface ConsensusRule {
  /** `top`: reviewers agree when their first choice is the same; `pairwise`: when they order at least `threshold` of the pairs alike. */
  kind: 'top' | 'pairwise';
  threshold?: number;
}

export interface NewBatch {
  name: string;
  sourceHash: string;
  sourceName: string;
  reviewsRequired?: number;
  blindFirst?: boolean;
  consensusRule?: ConsensusRule;
  rubricId?: string | null;
  createdBy?: number | null;
  items: NewItem[];
}

export interface StoredBatch {
  batchId: number;
  itemIds: number[];
}

/**
 * Stores a batch with all its items and responses in one transaction: all of it or none.
 * A batch whose source hash is already stored is refused with a `UserError` that names the
 * earlier batch, so importing the same file twice stores nothing new.
 */
export async function storeBatch(db: Kysely<Database>, batch: NewBatch): Promise<StoredBatch> {
  const existing = await findBatchBySource(db, batch.sourceHash);
  if (existing) {
    throw new UserError(`this file was already imported as batch "${existing.name}" on ${existing.created_at.slice(0, 10)} — nothing new was stored`);
  }
  return db.transaction().execute(async (trx) => {
    const createdAt = nowIso();
    const { id: batchId } = await trx
      .insertInto('batches')
      .values({
        name: batch.name,
        source_hash: batch.sourceHash,
        source_name: batch.sourceName,
        reviews_required: batch.reviewsRequired ?? 1,
        blind_first: batch.blindFirst === false ? 0 : 1,
        consensus_rule: JSON.stringify(batch.consensusRule ?? { kind: 'top' }),
        rubric_id: batch.rubricId ?? null,
        created_by: batch.createdBy ?? null,
        created_at: createdAt,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const itemIds: number[] = [];
    for (const item of batch.items) itemIds.push((await insertItem(trx, batchId, item, createdAt)).itemId);
    await recordAudit(trx, {
      actorId: batch.createdBy ?? null,
      kind: 'import',
      subject: `batch:${batchId}`,
      detail: { name: batch.name, items: batch.items.length, source: batch.sourceName },
    });
    return { batchId, itemIds };
  });
}

export function findBatchBySource(db: Kysely<Database>, sourceHash: string): Promise<Batch | undefined> {
  return db.selectFrom('batches').selectAll().where('source_hash', '=', sourceHash).executeTakeFirst();
}

export function findBatchByName(db: Kysely<Database>, name: string): Promise<Batch | undefined> {
  return db.selectFrom('batches').selectAll().where('name', '=', name).executeTakeFirst();
}

export interface BatchSummary {
  id: number;
  name: string;
  created_at: string;
  items: number;
  final: number;
}

/** Every batch with its item count and how many items are final. */
export async function listBatches(db: Kysely<Database>): Promise<BatchSummary[]> {
  const rows = await db
    .selectFrom('batches')
    .leftJoin('items', 'items.batch_id', 'batches.id')
    .select((eb) => [
      'batches.id',
      'batches.name',
      'batches.created_at',
      eb.fn.count<number>('items.id').as('items'),
      eb.fn.sum<number>(eb.case().when('items.state', '=', 'final').then(1).else(0).end()).as('final'),
    ])
    .where('batches.import_owner', 'is', null)
    .groupBy(['batches.id', 'batches.name', 'batches.created_at'])
    .orderBy('batches.created_at', 'desc')
    .orderBy('batches.id', 'desc')
    .execute();
  return rows.map((r) => ({ ...r, items: Number(r.items), final: Number(r.final ?? 0) }));
}

/**
 * Inserts one item with its responses (in file order) and returns the item's id and each
 * response's row id by its imported id. Used by every path that stores items.
 */
export async function insertItem(trx: Transaction<Database>, batchId: number, item: NewItem, createdAt: string, state: ItemState = 'open'): Promise<{ itemId: number; responseRows: Map<string, number> }> {
  const { id: itemId } = await trx
    .insertInto('items')
    .values({
      batch_id: batchId,
      prompt_id: item.promptId,
      prompt: item.prompt,
      flag_reason: item.flag?.reason ?? null,
      flag_severity: item.flag?.severity ?? null,
      meta: item.meta ? JSON.stringify(item.meta) : null,
      state,
      priority: item.priority ?? 0,
      created_at: createdAt,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const rows = await trx
    .insertInto('responses')
    .values(item.responses.map((r, position) => ({ item_id: itemId, response_id: r.responseId, text: r.text, position })))
    .returning(['id', 'response_id'])
    .execute();
  return { itemId, responseRows: new Map(rows.map((r) => [r.response_id, r.id])) };
}
