import type { Kysely, Transaction } from 'kysely';
import { nowIso } from '../../clock.ts';
import type { Database, ItemState, ReviewStatus } from '../schema.ts';

/** A ranking maps a response's id (as imported) to its rank; 1 is best, equal ranks are ties. */
export type Ranking = Record<string, number>;

export interface NewReview {
  itemId: number;
  reviewerId: number;
  status: ReviewStatus;
  displayOrder: string[];
  firstRanking?: Ranking | null;
  finalRanking?: Ranking | null;
  rationale?: string | null;
  reason?: string | null;
  rubricVersion?: string | null;
  startedAt: string;
  revealedAt?: string | null;
  submittedAt?: string;
  timeSpentMs: number;
}

type Db = Kysely<Database> | Transaction<Database>;

/** Stores one review exactly as given and returns its id. */
export async function insertReview(db: Db, review: NewReview): Promise<number> {
  const row = await db
    .insertInto('reviews')
    .values({
      item_id: review.itemId,
      reviewer_id: review.reviewerId,
      status: review.status,
      display_order: JSON.stringify(review.displayOrder),
      first_ranking: review.firstRanking ? JSON.stringify(review.firstRanking) : null,
      final_ranking: review.finalRanking ? JSON.stringify(review.finalRanking) : null,
      rationale: review.rationale ?? null,
      reason: review.reason ?? null,
      rubric_version: review.rubricVersion ?? null,
      started_at: review.startedAt,
      revealed_at: review.revealedAt ?? null,
      submitted_at: review.submittedAt ?? nowIso(),
      time_spent_ms: review.timeSpentMs,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

export interface NewDecision {
  itemId: number;
  adjudicatorId: number | null;
  method: 'consensus' | 'adjudication';
  ranking: Ranking;
  rationale?: string | null;
  rubricVersion?: string | null;
}

/** Records an item's final ranking and marks the item final. */
export async function insertDecision(db: Db, decision: NewDecision): Promise<void> {
  await db
    .insertInto('adjudications')
    .values({
      item_id: decision.itemId,
      adjudicator_id: decision.adjudicatorId,
      method: decision.method,
      ranking: JSON.stringify(decision.ranking),
      rationale: decision.rationale ?? null,
      rubric_version: decision.rubricVersion ?? null,
      created_at: nowIso(),
    })
    .execute();
  await setItemState(db, decision.itemId, 'final');
}

export async function setItemState(db: Db, itemId: number, state: ItemState): Promise<void> {
  await db.updateTable('items').set({ state }).where('id', '=', itemId).execute();
}
