import type { Kysely } from 'kysely';
import { pairwiseAgreement, type Ranks } from '../stats/pairwise-agreement.ts';
import type { Database } from '../store/schema.ts';
import type { Rubric } from './load.ts';
import { scoreItem, type ItemScore } from './score.ts';
import type { Band } from './spec.ts';

export interface ItemMove {
  itemId: number;
  promptId: string;
  before: number;
  after: number;
  /** Queue positions moved up (positive) or down (negative). */
  moved: number;
}

export interface BandChange {
  itemId: number;
  promptId: string;
  responseId: string;
  before: Band;
  after: Band;
  scoreBefore: number;
  scoreAfter: number;
}

export interface OrderChange {
  itemId: number;
  promptId: string;
  before: string[];
  after: string[];
}

export interface Impact {
  items: number;
  responses: number;
  moves: ItemMove[];
  bandChanges: BandChange[];
  orderChanges: OrderChange[];
  /** Mean pairwise agreement of the suggested order with final human rankings, where there are any. */
  humanAgreement: { items: number; before: number | null; after: number | null };
}

export interface StoredItem {
  id: number;
  promptId: string;
  prompt: string;
  flagSeverity: string | null;
  createdAt: string;
  responses: { responseId: string; text: string }[];
  /** The final human ranking, when the item is decided. */
  finalRanking: Ranks | null;
  /** Scores already stored for the rubric version asked for, when every response has one. */
  stored: ItemScore | null;
}

/**
 * A batch's items with their responses and final rankings, in a few queries. With `scored`, the
 * scores already stored under that rubric version come too, so a preview scores only the draft.
 */
export async function loadBatchItems(db: Kysely<Database>, batchId: number, scored?: { id: string; version: string }): Promise<StoredItem[]> {
  const items = await db.selectFrom('items').select(['id', 'prompt_id', 'prompt', 'flag_severity', 'created_at', 'priority']).where('batch_id', '=', batchId).orderBy('id').execute();
  const responses = await db
    .selectFrom('responses')
    .innerJoin('items', 'items.id', 'responses.item_id')
    .select(['responses.item_id', 'responses.response_id', 'responses.text'])
    .where('items.batch_id', '=', batchId)
    .orderBy('responses.item_id')
    .orderBy('responses.position')
    .execute();
  const decisions = await db.selectFrom('adjudications').innerJoin('items', 'items.id', 'adjudications.item_id').select(['adjudications.item_id', 'adjudications.ranking']).where('items.batch_id', '=', batchId).execute();
  const byItem = new Map<number, { responseId: string; text: string }[]>();
  for (const r of responses) {
    const list = byItem.get(r.item_id) ?? [];
    list.push({ responseId: r.response_id, text: r.text });
    byItem.set(r.item_id, list);
  }
  const finals = new Map(decisions.map((d) => [d.item_id, JSON.parse(d.ranking) as Ranks]));
  const stored = new Map<number, ItemScore['responses']>();
  if (scored) {
    const rows = await db
      .selectFrom('scores')
      .innerJoin('responses', 'responses.id', 'scores.response_id')
      .innerJoin('items', 'items.id', 'responses.item_id')
      .select(['responses.item_id', 'responses.response_id', 'scores.overall', 'scores.band', 'scores.suggested_rank'])
      .where('items.batch_id', '=', batchId)
      .where('scores.rubric_version', '=', scored.version)
      .orderBy('responses.item_id')
      .orderBy('responses.position')
      .execute();
    for (const r of rows) {
      const list = stored.get(r.item_id) ?? [];
      list.push({ responseId: r.response_id, score: Number(r.overall), band: r.band as Band, failedCritical: false, suggestedRank: Number(r.suggested_rank), criteria: {}, findings: [] });
      stored.set(r.item_id, list);
    }
  }
  return items.map((i) => {
    const responses = byItem.get(i.id) ?? [];
    const have = stored.get(i.id);
    const complete = scored && have && have.length === responses.length;
    return {
      id: i.id,
      promptId: i.prompt_id,
      prompt: i.prompt,
      flagSeverity: i.flag_severity,
      createdAt: i.created_at,
      responses,
      finalRanking: finals.get(i.id) ?? null,
      stored: complete ? { rubric: scored, responses: have, priority: { value: Number(i.priority), critical: false, uncertainty: 0, flag: 0 } } : null,
    };
  });
}

function scoreAll(rubric: Rubric, items: StoredItem[], useStored = false): ItemScore[] {
  return items.map((item) =>
    useStored && item.stored?.rubric.version === rubric.version ? item.stored : scoreItem(rubric, { prompt: item.prompt, responses: item.responses, flagSeverity: item.flagSeverity }),
  );
}

/** Queue positions (0 = first) of items under the triage order: priority, then age, then id. */
function queuePositions(items: StoredItem[], scores: ItemScore[]): Map<number, number> {
  const order = items
    .map((item, i) => ({ item, priority: scores[i].priority.value }))
    .sort((a, b) => b.priority - a.priority || a.item.createdAt.localeCompare(b.item.createdAt) || a.item.id - b.item.id);
  return new Map(order.map((o, position) => [o.item.id, position]));
}

const suggested = (s: ItemScore): Ranks => Object.fromEntries(s.responses.map((r) => [r.responseId, r.suggestedRank]));
const orderOf = (s: ItemScore) => [...s.responses].sort((a, b) => a.suggestedRank - b.suggestedRank || a.responseId.localeCompare(b.responseId)).map((r) => r.responseId);

function meanAgreement(items: StoredItem[], scores: ItemScore[]): number | null {
  const values = items.flatMap((item, i) => {
    if (!item.finalRanking) return [];
    const a = pairwiseAgreement(item.finalRanking, suggested(scores[i]));
    return a === null ? [] : [a];
  });
  return values.length ? values.reduce((x, y) => x + y, 0) / values.length : null;
}

/**
 * What a rubric change would do to a batch: scores its stored items under the draft (and under
 * the current rubric, unless its scores are stored) and reports which items move most in the queue, which candidates change band, which suggested
 * orders change, and how well each suggested order agrees with final human rankings.
 */
export function compareRubrics(current: Rubric, draft: Rubric, items: StoredItem[]): Impact {
  const before = scoreAll(current, items, true);
  const after = scoreAll(draft, items);
  const posBefore = queuePositions(items, before);
  const posAfter = queuePositions(items, after);
  const moves: ItemMove[] = items
    .map((item) => ({ itemId: item.id, promptId: item.promptId, before: posBefore.get(item.id)! + 1, after: posAfter.get(item.id)! + 1, moved: posBefore.get(item.id)! - posAfter.get(item.id)! }))
    .filter((m) => m.moved !== 0)
    .sort((a, b) => Math.abs(b.moved) - Math.abs(a.moved) || a.after - b.after);
  const bandChanges: BandChange[] = [];
  const orderChanges: OrderChange[] = [];
  items.forEach((item, i) => {
    before[i].responses.forEach((r, k) => {
      const a = after[i].responses[k];
      if (r.band !== a.band) bandChanges.push({ itemId: item.id, promptId: item.promptId, responseId: r.responseId, before: r.band, after: a.band, scoreBefore: r.score, scoreAfter: a.score });
    });
    const ob = orderOf(before[i]);
    const oa = orderOf(after[i]);
    if (ob.join() !== oa.join()) orderChanges.push({ itemId: item.id, promptId: item.promptId, before: ob, after: oa });
  });
  return {
    items: items.length,
    responses: items.reduce((n, i) => n + i.responses.length, 0),
    moves,
    bandChanges,
    orderChanges,
    humanAgreement: { items: items.filter((i) => i.finalRanking).length, before: meanAgreement(items, before), after: meanAgreement(items, after) },
  };
}
