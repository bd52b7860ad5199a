import type { Kysely } from 'kysely';
import type { CalibrationItem } from '../../stats/calibration.ts';
import type { Database } from '../schema.ts';

/**
 * The decided items of a batch with what calibration compares: final rankings, the newest stored
 * scores of each response (suggested rank and criterion values), text lengths and reviews.
 * Reviewer ids are given as user names.
 */
export async function loadCalibrationItems(db: Kysely<Database>, batchId: number): Promise<CalibrationItem[]> {
  const decided = await db.selectFrom('adjudications').innerJoin('items', 'items.id', 'adjudications.item_id').select(['items.id', 'adjudications.ranking']).where('items.batch_id', '=', batchId).execute();
  if (!decided.length) return [];
  const ids = decided.map((d) => d.id);
  const responses = await db.selectFrom('responses').select(['id', 'item_id', 'response_id', 'text']).where('item_id', 'in', ids).execute();
  const scores = await db
    .selectFrom('scores')
    .select(['response_id', 'suggested_rank', 'criteria', 'id'])
    .where('response_id', 'in', responses.map((r) => r.id))
    .orderBy('id', 'asc')
    .execute();
  const reviews = await db
    .selectFrom('reviews')
    .innerJoin('users', 'users.id', 'reviews.reviewer_id')
    .select(['reviews.item_id', 'users.username', 'reviews.display_order', 'reviews.first_ranking', 'reviews.final_ranking', 'reviews.revealed_at'])
    .where('reviews.item_id', 'in', ids)
    .where('reviews.status', '=', 'submitted')
    .execute();
  const latest = new Map<number, (typeof scores)[number]>();
  for (const s of scores) latest.set(s.response_id, s); // ordered by id: the newest wins
  return decided.map((d) => {
    const item: CalibrationItem = { final: JSON.parse(d.ranking), suggested: {}, criteria: {}, lengths: {}, reviews: [] };
    for (const r of responses.filter((x) => x.item_id === d.id)) {
      item.lengths[r.response_id] = r.text.length;
      const s = latest.get(r.id);
      if (!s) continue;
      item.suggested[r.response_id] = Number(s.suggested_rank);
      for (const [criterion, c] of Object.entries(JSON.parse(s.criteria) as Record<string, { value: number }>)) {
        (item.criteria[criterion] ??= {})[r.response_id] = c.value;
      }
    }
    item.reviews = reviews
      .filter((r) => r.item_id === d.id)
      .map((r) => ({ reviewer: r.username, displayOrder: JSON.parse(r.display_order), first: r.first_ranking ? JSON.parse(r.first_ranking) : null, final: r.final_ranking ? JSON.parse(r.final_ranking) : null, revealed: r.revealed_at !== null }));
    return item;
  });
}
