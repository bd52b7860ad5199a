import type { Kysely } from 'kysely';
import type { Band } from '../../rubric/spec.ts';
import type { Database, ItemState } from '../schema.ts';

export interface QueueFilter {
  batchId?: number;
  flagged?: boolean;
  /** Items with at least one response scored in this band. */
  band?: Band;
  /** Items with at least one finding of this check. */
  check?: string;
  states?: ItemState[];
  limit?: number;
  offset?: number;
}

export interface QueueRow {
  id: number;
  prompt_id: string;
  prompt: string;
  batch_name: string;
  flag_reason: string | null;
  flag_severity: string | null;
  state: ItemState;
  priority: number;
  created_at: string;
  responses: number;
  reviews: number;
  reviews_required: number;
}

/**
 * Items awaiting work in triage order: highest priority first, then oldest, then by id so the
 * order is stable. By default only open and in-review items are listed.
 *
 * Each state is read on its own in index order (`items_queue_page`), so a page costs about
 * `offset + limit` index entries per state however many items wait (the counts in the select
 * list are worked out for those rows only); the states are merged here.
 */
export async function listQueue(db: Kysely<Database>, filter: QueueFilter = {}): Promise<QueueRow[]> {
  const limit = filter.limit ?? 50;
  const offset = filter.offset ?? 0;
  const perState = await Promise.all((filter.states ?? ['open', 'in_review']).map((state) => pageOfState(db, state, filter, offset + limit)));
  const page = perState.flat().sort(queueOrder).slice(offset, offset + limit);
  return page.map((r) => ({ ...r, priority: Number(r.priority), responses: Number(r.responses ?? 0), reviews: Number(r.reviews ?? 0) }));
}

function queueOrder(a: { priority: number; created_at: string; id: number }, b: { priority: number; created_at: string; id: number }): number {
  return Number(b.priority) - Number(a.priority) || (a.created_at < b.created_at ? -1 : a.created_at > b.created_at ? 1 : 0) || a.id - b.id;
}

/** The first `count` items of one state that pass the filter, in queue order. */
async function pageOfState(db: Kysely<Database>, state: ItemState, filter: QueueFilter, count: number) {
  let query = db
    .selectFrom('items')
    .innerJoin('batches', 'batches.id', 'items.batch_id')
    .select((eb) => [
      'items.id',
      'items.prompt_id',
      'items.prompt',
      'batches.name as batch_name',
      'items.flag_reason',
      'items.flag_severity',
      'items.state',
      'items.priority',
      'items.created_at',
      'batches.reviews_required',
      eb.selectFrom('responses').whereRef('responses.item_id', '=', 'items.id').select((e) => e.fn.countAll<number>().as('n')).as('responses'),
      eb.selectFrom('reviews').whereRef('reviews.item_id', '=', 'items.id').where('reviews.status', '=', 'submitted').select((e) => e.fn.countAll<number>().as('n')).as('reviews'),
    ])
    .where('items.state', '=', state);
  if (filter.batchId !== undefined) query = query.where('items.batch_id', '=', filter.batchId);
  if (filter.flagged) query = query.where('items.flag_severity', 'is not', null);
  if (filter.band) query = query.where('items.score_bands', 'like', `%,${filter.band},%`);
  if (filter.check) {
    if (!/^[a-z][a-z0-9-]*$/.test(filter.check)) throw new Error(`not a check id: "${filter.check}"`);
    query = query.where('items.finding_checks', 'like', `%,${filter.check},%`);
  }
  return query.orderBy('items.priority', 'desc').orderBy('items.created_at', 'asc').orderBy('items.id', 'asc').limit(count).execute();
}

/** Counts of items per state, for the home page summary. */
export async function countItemsByState(db: Kysely<Database>): Promise<Record<ItemState, number>> {
  const rows = await db.selectFrom('items').select((eb) => ['state', eb.fn.countAll<number>().as('n')]).groupBy('state').execute();
  const counts: Record<ItemState, number> = { staged: 0, open: 0, in_review: 0, adjudication: 0, final: 0, escalated: 0 };
  for (const row of rows) counts[row.state] = Number(row.n);
  return counts;
}

/** Every batch's id and name, newest first, for the queue's batch filter. */
export async function batchNames(db: Kysely<Database>): Promise<{ id: number; name: string }[]> {
  return db.selectFrom('batches').select(['id', 'name']).where('import_owner', 'is', null).orderBy('id', 'desc').execute();
}
