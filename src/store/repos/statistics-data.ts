import type { Kysely } from 'kysely';
import { bootstrapInterval } from '../../stats/bootstrap.ts';
import { calibrate, type Calibration } from '../../stats/calibration.ts';
import { pairwiseAgreement, type Ranks } from '../../stats/pairwise-agreement.ts';
import type { Database } from '../schema.ts';
import { loadCalibrationItems } from './calibration-data.ts';

export interface Exposure {
  reviewer: string;
  today: number;
  total: number;
  skipped: number;
}

export interface BatchStatistics {
  /** Mean pairwise agreement between reviewers of the same item, with a 95% bootstrap interval over items. */
  reviewerAgreement: { value: number | null; items: number; interval: { low: number; high: number } | null };
  calibration: Calibration;
  exposure: Exposure[];
}

/** Mean agreement over every pair of reviewers' rankings of one item. */
function itemAgreement(rankings: Ranks[]): number | null {
  const values: number[] = [];
  for (let i = 0; i < rankings.length; i++) {
    for (let j = i + 1; j < rankings.length; j++) {
      const a = pairwiseAgreement(rankings[i], rankings[j]);
      if (a !== null) values.push(a);
    }
  }
  return values.length ? values.reduce((x, y) => x + y, 0) / values.length : null;
}

const mean = (xs: number[]) => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : null);

/** The numbers on the statistics page, for one batch or (batchId null) every batch. */
export async function batchStatistics(db: Kysely<Database>, batchId: number | null): Promise<BatchStatistics> {
  let reviews = db
    .selectFrom('reviews')
    .innerJoin('items', 'items.id', 'reviews.item_id')
    .innerJoin('users', 'users.id', 'reviews.reviewer_id')
    .select(['reviews.item_id', 'reviews.final_ranking', 'reviews.status', 'reviews.submitted_at', 'users.username']);
  if (batchId !== null) reviews = reviews.where('items.batch_id', '=', batchId);
  const rows = await reviews.execute();
  const byItem = new Map<number, Ranks[]>();
  for (const r of rows) {
    if (r.status !== 'submitted' || !r.final_ranking) continue;
    const list = byItem.get(r.item_id) ?? [];
    list.push(JSON.parse(r.final_ranking));
    byItem.set(r.item_id, list);
  }
  const perItem = [...byItem.values()].filter((l) => l.length >= 2).map(itemAgreement).filter((v): v is number => v !== null);
  const today = new Date().toISOString().slice(0, 10);
  const exposure = new Map<string, Exposure>();
  for (const r of rows) {
    const e = exposure.get(r.username) ?? { reviewer: r.username, today: 0, total: 0, skipped: 0 };
    if (r.status === 'skipped') e.skipped++;
    else {
      e.total++;
      if (r.submitted_at.startsWith(today)) e.today++;
    }
    exposure.set(r.username, e);
  }
  const batches = batchId !== null ? [batchId] : (await db.selectFrom('batches').select('id').execute()).map((b) => b.id);
  const items = (await Promise.all(batches.map((id) => loadCalibrationItems(db, id)))).flat();
  return {
    reviewerAgreement: { value: mean(perItem), items: perItem.length, interval: bootstrapInterval(perItem, mean) },
    calibration: calibrate(items),
    exposure: [...exposure.values()].sort((a, b) => a.reviewer.localeCompare(b.reviewer)),
  };
}
