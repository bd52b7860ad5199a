import { sql, type Transaction } from 'kysely';
import { UserError } from '../errors.ts';
import type { Ranks } from '../stats/pairwise-agreement.ts';
import type { Store } from '../store/connect.ts';
import { recordAudit } from '../store/repos/audit.ts';
import { insertDecision, insertReview, setItemState } from '../store/repos/reviews.ts';
import type { Database, ItemState } from '../store/schema.ts';
import { applyConsensus, type ConsensusRule, type Verdict } from './consensus.ts';
import { rankingProblem } from './ranking.ts';

/** Someone else got there first, or the item moved on: nothing was written. */
export class ReviewConflict extends UserError {
  constructor(message: string) {
    super(message);
    this.name = 'ReviewConflict';
  }
}

/** The submission itself is incomplete or wrong: nothing was written. */
export class ReviewInvalid extends UserError {
  constructor(message: string) {
    super(message);
    this.name = 'ReviewInvalid';
  }
}

/** How long a claim holds an item for one reviewer before it returns to the queue. */
export const DEFAULT_CLAIM_MS = 30 * 60 * 1000;
export const DEFAULT_MIN_RATIONALE = 20;
const OPEN: ItemState[] = ['open', 'in_review'];

type Trx = Transaction<Database>;

/**
 * Claims the next item for a reviewer, in triage order: an item still open, that this reviewer
 * has not reviewed or skipped, and whose submitted reviews plus other reviewers' live claims are
 * fewer than the batch's review count — so no item is handed to more reviewers than it needs.
 * A reviewer's own live claim is returned again. Expired claims are removed first. On PostgreSQL
 * the candidate row is locked with FOR UPDATE SKIP LOCKED, so app instances never hand out the
 * same place twice.
 */
export async function claimNext(store: Store, userId: number, options: { batchId?: number; ttlMs?: number; now?: number } = {}): Promise<{ itemId: number; expiresAt: string } | null> {
  const now = options.now ?? Date.now();
  const nowIso = new Date(now).toISOString();
  const expiresAt = new Date(now + (options.ttlMs ?? DEFAULT_CLAIM_MS)).toISOString();
  return store.db.transaction().execute(async (trx) => {
    await trx.deleteFrom('work_claims').where('expires_at', '<=', nowIso).execute();
    const own = await trx.selectFrom('work_claims').innerJoin('items', 'items.id', 'work_claims.item_id').select(['work_claims.item_id', 'work_claims.expires_at']).where('work_claims.user_id', '=', userId).where('items.state', 'in', OPEN).executeTakeFirst();
    if (own) return { itemId: own.item_id, expiresAt: own.expires_at };
    const capacity = sql<number>`(select count(*) from reviews where reviews.item_id = items.id and reviews.status = 'submitted') + (select count(*) from work_claims where work_claims.item_id = items.id)`;
    const required = sql<number>`(select reviews_required from batches where batches.id = items.batch_id)`;
    const passedOver: number[] = [];
    let next: { id: number } | undefined;
    for (let attempt = 0; attempt < 20 && !next; attempt++) {
      let query = trx
        .selectFrom('items')
        .select('items.id')
        .where('items.state', 'in', OPEN)
        .where(({ not, exists, selectFrom }) => not(exists(selectFrom('reviews').select('reviews.id').whereRef('reviews.item_id', '=', 'items.id').where('reviews.reviewer_id', '=', userId))))
        .where(capacity, '<', required)
        .orderBy('items.priority', 'desc')
        .orderBy('items.created_at', 'asc')
        .orderBy('items.id', 'asc')
        .limit(1);
      if (options.batchId !== undefined) query = query.where('items.batch_id', '=', options.batchId);
      if (passedOver.length) query = query.where('items.id', 'not in', passedOver);
      if (store.kind === 'postgres') query = query.forUpdate().skipLocked();
      const candidate = await query.executeTakeFirst();
      if (!candidate) return null;
      // The row lock is ours now, but the counts above came from the statement's snapshot, taken
      // before the lock: a claim committed in between would be missed. Count again.
      const recount = await trx.selectFrom('items').select([capacity.as('taken'), required.as('required')]).where('items.id', '=', candidate.id).executeTakeFirstOrThrow();
      if (Number(recount.taken) < Number(recount.required)) next = candidate;
      else passedOver.push(candidate.id);
    }
    if (!next) return null;
    await trx.insertInto('work_claims').values({ item_id: next.id, user_id: userId, claimed_at: nowIso, expires_at: expiresAt }).execute();
    await recordAudit(trx, { actorId: userId, kind: 'claim', subject: `item:${next.id}` });
    return { itemId: next.id, expiresAt };
  });
}

export interface ReviewSubmission {
  itemId: number;
  reviewerId: number;
  status: 'submitted' | 'skipped' | 'escalated';
  displayOrder: string[];
  firstRanking?: Ranks | null;
  finalRanking?: Ranks | null;
  rationale?: string | null;
  reason?: string | null;
  rubricVersion?: string | null;
  startedAt: string;
  revealedAt?: string | null;
  timeSpentMs: number;
}

async function responseIds(trx: Trx, itemId: number): Promise<string[]> {
  return (await trx.selectFrom('responses').select('response_id').where('item_id', '=', itemId).orderBy('position').execute()).map((r) => r.response_id);
}

/**
 * Records a reviewer's decision on a claimed item: a ranking with its rationale, or a skip or
 * escalation with a reason (a skip never counts against anyone). When the item has all its
 * reviews, the batch's consensus rule either makes it final or sends it to adjudication.
 */
export async function submitReview(store: Store, input: ReviewSubmission, options: { minRationale?: number; now?: number } = {}): Promise<{ state: ItemState; verdict?: Verdict }> {
  const nowIso = new Date(options.now ?? Date.now()).toISOString();
  return store.db.transaction().execute(async (trx) => {
    // Lock the item row first (PostgreSQL) so that two reviewers finishing the same item at once
    // are serialised: the second sees the first's review and applies the consensus rule.
    let locked = trx.selectFrom('items').select('items.id').where('items.id', '=', input.itemId);
    if (store.kind === 'postgres') locked = locked.forUpdate();
    await locked.executeTakeFirst();
    const item = await trx.selectFrom('items').innerJoin('batches', 'batches.id', 'items.batch_id').select(['items.id', 'items.state', 'batches.reviews_required', 'batches.consensus_rule', 'batches.rationale_min']).where('items.id', '=', input.itemId).executeTakeFirst();
    if (!item) throw new ReviewInvalid(`there is no item ${input.itemId}`);
    if (!OPEN.includes(item.state)) throw new ReviewConflict(`this item is no longer open for review (it is ${item.state.replace('_', ' ')}); take the next one from the queue`);
    const claim = await trx.selectFrom('work_claims').select('id').where('item_id', '=', input.itemId).where('user_id', '=', input.reviewerId).where('expires_at', '>', nowIso).executeTakeFirst();
    if (!claim) throw new ReviewConflict('your claim on this item has expired and it went back to the queue; claim it again to submit');

    if (input.status === 'submitted') {
      const ids = await responseIds(trx, input.itemId);
      for (const [label, ranking] of [['final ranking', input.finalRanking], ['first ranking', input.firstRanking]] as const) {
        if (label === 'first ranking' && !ranking) continue;
        if (!ranking) throw new ReviewInvalid('rank the responses before submitting');
        const problem = rankingProblem(ranking, ids);
        if (problem) throw new ReviewInvalid(`${label}: ${problem}`);
      }
      const min = options.minRationale ?? Number(item.rationale_min ?? DEFAULT_MIN_RATIONALE);
      if ((input.rationale ?? '').trim().length < min) throw new ReviewInvalid(`write a rationale of at least ${min} characters: what decided the order`);
    } else if (!(input.reason ?? '').trim()) {
      throw new ReviewInvalid(`say why you ${input.status === 'skipped' ? 'skip' : 'escalate'} this item`);
    }

    await insertReview(trx, { ...input, submittedAt: nowIso });
    await trx.deleteFrom('work_claims').where('id', '=', claim.id).execute();
    await recordAudit(trx, { actorId: input.reviewerId, kind: input.status === 'submitted' ? 'review' : input.status === 'skipped' ? 'skip' : 'escalate', subject: `item:${input.itemId}`, detail: input.reason ? { reason: input.reason } : undefined });
    if (input.status === 'skipped') return { state: item.state };
    if (input.status === 'escalated') {
      await setItemState(trx, input.itemId, 'escalated');
      return { state: 'escalated' };
    }
    const reviews = await trx.selectFrom('reviews').select('final_ranking').where('item_id', '=', input.itemId).where('status', '=', 'submitted').execute();
    if (reviews.length < item.reviews_required) {
      await setItemState(trx, input.itemId, 'in_review');
      return { state: 'in_review' };
    }
    const verdict = applyConsensus(reviews.map((r) => JSON.parse(r.final_ranking!) as Ranks), JSON.parse(item.consensus_rule) as ConsensusRule);
    if (verdict.agreed) {
      await insertDecision(trx, { itemId: input.itemId, adjudicatorId: null, method: 'consensus', ranking: verdict.ranking, rationale: `reviewers agreed (pairwise agreement ${(verdict.agreement * 100).toFixed(0)}%)`, rubricVersion: input.rubricVersion ?? null });
      return { state: 'final', verdict };
    }
    await setItemState(trx, input.itemId, 'adjudication');
    return { state: 'adjudication', verdict };
  });
}

/**
 * Records an adjudicator's final ranking for an item that needs one. When two people decide the
 * same item at once, the second gets a `ReviewConflict` naming who decided first; nothing is
 * overwritten (the decision's item id is unique in the database).
 */
export async function adjudicate(store: Store, input: { itemId: number; adjudicatorId: number; ranking: Ranks; rationale: string; rubricVersion?: string | null }, options: { minRationale?: number } = {}): Promise<void> {
  const earlier = async () => {
    const row = await store.db.selectFrom('adjudications').leftJoin('users', 'users.id', 'adjudications.adjudicator_id').select(['users.display_name', 'adjudications.created_at', 'adjudications.method']).where('adjudications.item_id', '=', input.itemId).executeTakeFirst();
    return row ? new ReviewConflict(`this item was already decided ${row.method === 'consensus' ? 'by consensus' : `by ${row.display_name ?? 'another adjudicator'}`} at ${row.created_at.slice(0, 16).replace('T', ' ')} UTC; your decision was not saved — reload to see theirs`) : null;
  };
  try {
    await store.db.transaction().execute(async (trx) => {
      const item = await trx.selectFrom('items').innerJoin('batches', 'batches.id', 'items.batch_id').select(['items.state', 'batches.rationale_min']).where('items.id', '=', input.itemId).executeTakeFirst();
      if (!item) throw new ReviewInvalid(`there is no item ${input.itemId}`);
      if (item.state === 'final') throw new AlreadyDecided(); // who decided is read after the transaction
      if (item.state !== 'adjudication' && item.state !== 'escalated') throw new ReviewConflict(`this item does not need adjudication (it is ${item.state.replace('_', ' ')})`);
      const problem = rankingProblem(input.ranking, await responseIds(trx, input.itemId));
      if (problem) throw new ReviewInvalid(`ranking: ${problem}`);
      const min = options.minRationale ?? Number(item.rationale_min ?? DEFAULT_MIN_RATIONALE);
      if (input.rationale.trim().length < min) throw new ReviewInvalid(`write a rationale of at least ${min} characters for the decision`);
      await insertDecision(trx, { itemId: input.itemId, adjudicatorId: input.adjudicatorId, method: 'adjudication', ranking: input.ranking, rationale: input.rationale, rubricVersion: input.rubricVersion ?? null });
      await recordAudit(trx, { actorId: input.adjudicatorId, kind: 'adjudication', subject: `item:${input.itemId}` });
    });
  } catch (error) {
    if (error instanceof UserError && !(error instanceof AlreadyDecided)) throw error;
    // already final, or a concurrent decision hit the unique item id: report who won
    const conflict = await earlier();
    if (conflict) throw conflict;
    throw error instanceof AlreadyDecided ? new ReviewConflict('this item is already final') : error;
  }
}

/** Internal: the item turned out final inside the transaction (SQLite has one connection, so the winner is looked up after it). */
class AlreadyDecided extends UserError {
  constructor() {
    super('already decided');
  }
}
