import { createHmac, randomBytes } from 'node:crypto';
import type { Kysely } from 'kysely';
import { personalData } from '../checks/personal-data.ts';
import { analyze } from '../text/analyze.ts';
import { meanPairwiseAgreement } from '../review/consensus.ts';
import type { Ranks } from '../stats/pairwise-agreement.ts';
import type { Database } from '../store/schema.ts';
import { getSetting, setSettingOnce } from '../store/repos/settings.ts';

export interface ExportOptions {
  format: 'pairs' | 'rankings';
  batchName?: string;
  /** Decisions made on or after this ISO date or time. */
  since?: string;
  includeTies?: boolean;
  redactPii?: boolean;
}

/** One decided item, with everything an export record needs. */
export interface DecidedItem {
  batch: string;
  promptId: string;
  prompt: string;
  responses: { responseId: string; text: string }[];
  ranking: Ranks;
  decidedBy: 'consensus' | 'adjudication';
  decidedAt: string;
  reviewers: string[];
  agreement: number | null;
  rubric: { id: string | null; version: string | null };
  rationale: string | null;
  reviewRationales: string[];
}

/** The installation's pseudonym salt, made once and kept in the database. */
async function pseudonymSalt(db: Kysely<Database>): Promise<string> {
  await setSettingOnce(db, 'pseudonym_salt', randomBytes(32).toString('hex'));
  return (await getSetting(db, 'pseudonym_salt'))!;
}

/** A reviewer's stable pseudonym: HMAC-SHA-256 of the user id under the installation's salt. */
export function pseudonym(salt: string, userId: number): string {
  return `rv_${createHmac('sha256', salt).update(String(userId)).digest('hex').slice(0, 12)}`;
}

/** The text with personal data replaced by its kind, e.g. "[email removed]". */
export function redact(text: string): string {
  const found = personalData.run(analyze(text)).findings;
  let out = '';
  let last = 0;
  for (const f of found) {
    if (f.start < last) continue;
    out += `${text.slice(last, f.start)}[${f.message.replace(/-/g, ' ')} removed]`;
    last = f.end;
  }
  return out + text.slice(last);
}

/**
 * Decided items in decision order, a page at a time (flat memory), filtered by batch and date.
 * Reviewer ids are pseudonymised; agreement is the mean pairwise agreement of the reviewers'
 * final rankings (null with fewer than two).
 */
export async function* decidedItems(db: Kysely<Database>, options: ExportOptions): AsyncGenerator<DecidedItem> {
  const salt = await pseudonymSalt(db);
  let after = 0;
  for (;;) {
    let query = db
      .selectFrom('adjudications')
      .innerJoin('items', 'items.id', 'adjudications.item_id')
      .innerJoin('batches', 'batches.id', 'items.batch_id')
      .select(['adjudications.id as decision_id', 'adjudications.ranking', 'adjudications.method', 'adjudications.rationale', 'adjudications.created_at', 'adjudications.rubric_version', 'items.id as item_id', 'items.prompt_id', 'items.prompt', 'batches.name as batch', 'batches.rubric_id'])
      .where('adjudications.id', '>', after)
      .orderBy('adjudications.id')
      .limit(200);
    if (options.batchName) query = query.where('batches.name', '=', options.batchName);
    if (options.since) query = query.where('adjudications.created_at', '>=', options.since);
    const page = await query.execute();
    if (!page.length) return;
    const ids = page.map((p) => p.item_id);
    const responses = await db.selectFrom('responses').select(['id', 'item_id', 'response_id', 'text']).where('item_id', 'in', ids).orderBy('item_id').orderBy('position').execute();
    const reviews = await db.selectFrom('reviews').select(['item_id', 'reviewer_id', 'final_ranking', 'rationale']).where('item_id', 'in', ids).where('status', '=', 'submitted').orderBy('id').execute();
    const versions = await db
      .selectFrom('scores')
      .innerJoin('responses', 'responses.id', 'scores.response_id')
      .select(['responses.item_id', 'scores.rubric_version', 'scores.id'])
      .where('responses.item_id', 'in', ids)
      .orderBy('scores.id')
      .execute();
    const latestVersion = new Map(versions.map((v) => [v.item_id, v.rubric_version]));
    for (const row of page) {
      const itemReviews = reviews.filter((r) => r.item_id === row.item_id);
      const rankings = itemReviews.filter((r) => r.final_ranking).map((r) => JSON.parse(r.final_ranking!) as Ranks);
      const texts = responses.filter((r) => r.item_id === row.item_id).map((r) => ({ responseId: r.response_id, text: options.redactPii ? redact(r.text) : r.text }));
      yield {
        batch: row.batch,
        promptId: row.prompt_id,
        prompt: options.redactPii ? redact(row.prompt) : row.prompt,
        responses: texts,
        ranking: JSON.parse(row.ranking),
        decidedBy: row.method,
        decidedAt: row.created_at,
        reviewers: itemReviews.map((r) => pseudonym(salt, r.reviewer_id)),
        agreement: rankings.length >= 2 ? Math.round(meanPairwiseAgreement(rankings) * 1000) / 1000 : null,
        rubric: { id: row.rubric_id, version: row.rubric_version ?? latestVersion.get(row.item_id) ?? null },
        rationale: row.rationale,
        reviewRationales: itemReviews.map((r) => r.rationale ?? '').filter(Boolean),
      };
    }
    after = page[page.length - 1].decision_id;
  }
}

/** An export record of the pairs format: one per ordered pair of the final ranking. */
export interface PairRecord {
  batch: string;
  prompt_id: string;
  prompt: string;
  preferred_id: string;
  preferred_text: string;
  preferred_rank: number;
  other_id: string;
  other_text: string;
  other_rank: number;
  tie: boolean;
  decided_by: 'consensus' | 'adjudication';
  decided_at: string;
  reviewer_count: number;
  reviewer_ids: string[];
  reviewer_agreement: number | null;
  rubric_id: string | null;
  rubric_version: string | null;
  rationale: string | null;
}

/** Every ordered pair of an item's final ranking (tied pairs only when asked, marked `tie`). */
export function pairsOf(item: DecidedItem, includeTies: boolean): PairRecord[] {
  const out: PairRecord[] = [];
  const rs = item.responses;
  for (let i = 0; i < rs.length; i++) {
    for (let j = i + 1; j < rs.length; j++) {
      const [a, b] = [rs[i], rs[j]];
      const ra = item.ranking[a.responseId];
      const rb = item.ranking[b.responseId];
      if (ra === rb && !includeTies) continue;
      const [better, worse] = ra <= rb ? [a, b] : [b, a];
      out.push({
        batch: item.batch,
        prompt_id: item.promptId,
        prompt: item.prompt,
        preferred_id: better.responseId,
        preferred_text: better.text,
        preferred_rank: item.ranking[better.responseId],
        other_id: worse.responseId,
        other_text: worse.text,
        other_rank: item.ranking[worse.responseId],
        tie: ra === rb,
        ...decisionFields(item),
      });
    }
  }
  return out;
}

/** How an item's ranking was decided: the provenance every export record carries. */
function decisionFields(item: DecidedItem) {
  return {
    decided_by: item.decidedBy,
    decided_at: item.decidedAt,
    reviewer_count: item.reviewers.length,
    reviewer_ids: item.reviewers,
    reviewer_agreement: item.agreement,
    rubric_id: item.rubric.id,
    rubric_version: item.rubric.version,
    rationale: item.rationale,
  };
}

/** An export record of the rankings format: one per decided item. */
export function rankingOf(item: DecidedItem) {
  return {
    batch: item.batch,
    prompt_id: item.promptId,
    prompt: item.prompt,
    responses: item.responses.map((r) => ({ response_id: r.responseId, text: r.text, rank: item.ranking[r.responseId] })).sort((x, y) => x.rank - y.rank),
    ...decisionFields(item),
    review_rationales: item.reviewRationales,
  };
}
