import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { migrate } from '../../src/store/migrate.ts';
import { storeBatch } from '../../src/store/repos/batches.ts';
import { createUser } from '../../src/store/repos/users.ts';
import { adjudicate, claimNext, ReviewConflict, ReviewInvalid, submitReview, type ReviewSubmission } from '../../src/review/workflow.ts';
import { applyConsensus } from '../../src/review/consensus.ts';
import { meanRanking, rankingProblem } from '../../src/review/ranking.ts';
import type { Store } from '../../src/store/connect.ts';
import { storeFactories } from '../helpers/stores.ts';

const RATIONALE = 'A answers fully; C leaks nothing but is vague.';

for (const factory of storeFactories()) {
  describe(`review workflow on ${factory.kind}`, () => {
    let store: Store;
    const users: Record<string, number> = {};
    const items: Record<string, number> = {};
    const T0 = Date.parse('2026-12-01T10:00:00Z');
    const review = (itemId: number, who: string, ranking: Record<string, number>, extra: Partial<ReviewSubmission> = {}): ReviewSubmission => ({
      itemId, reviewerId: users[who], status: 'submitted', displayOrder: ['c', 'a', 'b'], firstRanking: ranking, finalRanking: ranking, rationale: RATIONALE, startedAt: new Date(T0).toISOString(), timeSpentMs: 60_000, ...extra,
    });
    const count = async (table: 'reviews' | 'adjudications' | 'work_claims') => Number((await store.db.selectFrom(table).select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow()).n);
    const state = async (id: number) => (await store.db.selectFrom('items').select('state').where('id', '=', id).executeTakeFirstOrThrow()).state;

    beforeAll(async () => {
      store = await factory.open();
      await migrate(store);
      for (const u of ['r1', 'r2', 'r3', 'r4', 'adj1', 'adj2']) users[u] = await createUser(store.db, { username: u, displayName: `User ${u}`, password: 'pw-workflow', roles: u.startsWith('adj') ? ['adjudicator'] : ['reviewer'] });
      const responses = [{ responseId: 'a', text: 'A' }, { responseId: 'b', text: 'B' }, { responseId: 'c', text: 'C' }];
      const { itemIds } = await storeBatch(store.db, {
        name: 'workflow', sourceHash: 'workflow', sourceName: 'w.jsonl', reviewsRequired: 2, consensusRule: { kind: 'top' },
        items: ['A', 'B', 'C', 'D'].map((p, i) => ({ promptId: p, prompt: `Prompt ${p}`, responses, priority: 10 - i })),
      });
      ['A', 'B', 'C', 'D'].forEach((p, i) => (items[p] = itemIds[i]));
    });
    afterAll(async () => {
      await store.close();
      await factory.cleanup();
    });

    it('hands an item to no more reviewers than its review count, in priority order', async () => {
      expect((await claimNext(store, users.r1, { now: T0, ttlMs: 1000 }))?.itemId).toBe(items.A);
      expect((await claimNext(store, users.r2, { now: T0 }))?.itemId).toBe(items.A);
      expect((await claimNext(store, users.r3, { now: T0 }))?.itemId).toBe(items.B); // A has its two reviewers
      expect((await claimNext(store, users.r2, { now: T0 }))?.itemId).toBe(items.A); // a live claim is returned again
    });

    it('returns an expired claim to the queue', async () => {
      expect((await claimNext(store, users.r4, { now: T0 + 500 }))?.itemId).toBe(items.B);
      // r1's claim on A (1 s) has expired by T0 + 2 s: A has room again
      await store.db.deleteFrom('work_claims').where('user_id', '=', users.r4).execute();
      expect((await claimNext(store, users.r4, { now: T0 + 2000 }))?.itemId).toBe(items.A);
      const r1Claim = await submitReview(store, review(items.A, 'r1', { a: 1, b: 2, c: 3 }), { now: T0 + 2000 }).catch((e) => e);
      expect(r1Claim).toBeInstanceOf(ReviewConflict);
      expect(String(r1Claim.message)).toMatch(/claim on this item has expired/);
    });

    it('refuses an incomplete ranking or a short rationale and writes nothing', async () => {
      const before = await count('reviews');
      const cases: [Partial<ReviewSubmission>, RegExp][] = [
        [{ finalRanking: { a: 1, b: 2 } }, /c has no rank/],
        [{ finalRanking: { a: 1, b: 2, c: 4 } }, /rank of c must be a whole number from 1 to 3/],
        [{ finalRanking: { a: 1, b: 2, c: 3, z: 1 } }, /z is not a response/],
        [{ rationale: 'ok' }, /rationale of at least 20 characters/],
        [{ status: 'skipped', reason: ' ' }, /say why you skip/],
      ];
      for (const [change, message] of cases) {
        await expect(submitReview(store, review(items.A, 'r2', { a: 1, b: 2, c: 3 }, change), { now: T0 + 2000 })).rejects.toThrow(message);
      }
      await expect(submitReview(store, review(items.A, 'r2', { a: 1, b: 2, c: 3 }, { finalRanking: null }), { now: T0 + 2000 })).rejects.toBeInstanceOf(ReviewInvalid);
      // the batch sets its own minimum: RATIONALE (47 characters) is too short for 60
      await store.db.updateTable('batches').set({ rationale_min: 60 }).execute();
      await expect(submitReview(store, review(items.A, 'r2', { a: 1, b: 2, c: 3 }), { now: T0 + 2000 })).rejects.toThrow(/rationale of at least 60 characters/);
      await store.db.updateTable('batches').set({ rationale_min: 20 }).execute();
      expect(await count('reviews')).toBe(before);
    });

    it('makes an item final by consensus when both reviewers put the same response first', async () => {
      expect(await submitReview(store, review(items.A, 'r2', { a: 1, b: 2, c: 3 }), { now: T0 + 2000 })).toEqual({ state: 'in_review' });
      const result = await submitReview(store, review(items.A, 'r4', { a: 1, b: 3, c: 2 }), { now: T0 + 2000 });
      expect(result.state).toBe('final');
      const decision = await store.db.selectFrom('adjudications').selectAll().where('item_id', '=', items.A).executeTakeFirstOrThrow();
      expect(decision.method).toBe('consensus');
      expect(JSON.parse(decision.ranking)).toEqual({ a: 1, b: 2, c: 2 }); // mean ranks b 2.5, c 2.5 tie
      expect(await count('work_claims')).toBeGreaterThanOrEqual(1); // r3's claim on B is untouched
    });

    it('sends disagreeing reviews to adjudication, where the second of two deciders gets a clear conflict', async () => {
      await submitReview(store, review(items.B, 'r3', { a: 1, b: 2, c: 3 }), { now: T0 + 2000 });
      expect((await claimNext(store, users.r1, { now: T0 + 2000 }))?.itemId).toBe(items.B);
      const result = await submitReview(store, review(items.B, 'r1', { b: 1, a: 2, c: 3 }), { now: T0 + 2000 });
      expect(result.state).toBe('adjudication');
      expect(result.verdict).toMatchObject({ agreed: false, why: 'different first choices (a / b)' });
      const decide = (who: string) => adjudicate(store, { itemId: items.B, adjudicatorId: users[who], ranking: { a: 1, b: 2, c: 3 }, rationale: `${who}: A is complete; B misses the caveat.` });
      const outcomes = await Promise.allSettled([decide('adj1'), decide('adj2')]);
      expect(outcomes.filter((o) => o.status === 'fulfilled')).toHaveLength(1);
      const refused = outcomes.find((o) => o.status === 'rejected') as PromiseRejectedResult;
      expect(refused.reason).toBeInstanceOf(ReviewConflict);
      expect(String(refused.reason.message)).toMatch(/already decided by User adj[12] at .* your decision was not saved/);
      expect(Number((await store.db.selectFrom('adjudications').select(sql<number>`count(*)`.as('n')).where('item_id', '=', items.B).executeTakeFirstOrThrow()).n)).toBe(1);
      expect(await state(items.B)).toBe('final');
    });

    it('lets a reviewer skip without penalty (not offered again, not counted) and escalate with a reason', async () => {
      const claimed = await claimNext(store, users.r1, { now: T0 + 3000 });
      expect(claimed?.itemId).toBe(items.C);
      expect(await submitReview(store, review(items.C, 'r1', {}, { status: 'skipped', reason: 'too distressing today', finalRanking: null, firstRanking: null, rationale: null }), { now: T0 + 3000 })).toEqual({ state: 'open' });
      expect((await claimNext(store, users.r1, { now: T0 + 3000 }))?.itemId).toBe(items.D);
      expect((await claimNext(store, users.r2, { now: T0 + 3000 }))?.itemId).toBe(items.C); // the skip freed the place
      const escalated = await submitReview(store, review(items.C, 'r2', {}, { status: 'escalated', reason: 'possible real customer data', finalRanking: null, firstRanking: null, rationale: null }), { now: T0 + 3000 });
      expect(escalated.state).toBe('escalated');
      await adjudicate(store, { itemId: items.C, adjudicatorId: users.adj1, ranking: { a: 2, b: 1, c: 3 }, rationale: 'Escalated: decided by an adjudicator.' });
      expect(await state(items.C)).toBe('final');
    });
  });
}

describe('rankings and the consensus rule', () => {
  it('checks rankings and builds the mean ranking with ties', () => {
    expect(rankingProblem({ a: 1, b: 1, c: 3 }, ['a', 'b', 'c'])).toBeNull();
    expect(meanRanking([{ a: 1, b: 2, c: 3 }, { a: 2, b: 1, c: 3 }])).toEqual({ a: 1, b: 1, c: 3 });
  });
  it('applies the pairwise threshold', () => {
    expect(applyConsensus([{ a: 1, b: 2, c: 3 }, { a: 1, b: 3, c: 2 }], { kind: 'pairwise', threshold: 0.6 })).toMatchObject({ agreed: true });
    expect(applyConsensus([{ a: 1, b: 2, c: 3 }, { a: 1, b: 3, c: 2 }], { kind: 'pairwise', threshold: 0.75 })).toMatchObject({ agreed: false, why: 'pairwise agreement 67% is below 75%' });
  });
});
