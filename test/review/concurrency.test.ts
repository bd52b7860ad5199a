import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { migrate } from '../../src/store/migrate.ts';
import { storeBatch } from '../../src/store/repos/batches.ts';
import { createUser } from '../../src/store/repos/users.ts';
import { claimNext, submitReview } from '../../src/review/workflow.ts';
import type { Store } from '../../src/store/connect.ts';
import { storeFactories } from '../helpers/stores.ts';

const REVIEWERS = 50;
const ITEMS = 1000;
const REQUIRED = 2;

for (const factory of storeFactories()) {
  describe(`${REVIEWERS} reviewers at once on ${factory.kind}${factory.kind === 'postgres' ? ' with two app instances' : ''}`, () => {
    let store: Store;
    let second: Store;
    const reviewers: number[] = [];

    beforeAll(async () => {
      store = await factory.open();
      await migrate(store);
      // a second instance: its own connection pool on the same database (PostgreSQL), or the same store (SQLite, one file)
      second = factory.kind === 'postgres' ? await factory.openAgain() : store;
      for (let i = 0; i < REVIEWERS; i++) reviewers.push(await createUser(store.db, { username: `load${i}`, displayName: `Load ${i}`, password: 'pw-load-test', roles: ['reviewer'] }));
      await storeBatch(store.db, {
        name: 'load', sourceHash: 'load', sourceName: 'load.jsonl', reviewsRequired: REQUIRED, consensusRule: { kind: 'top' },
        items: Array.from({ length: ITEMS }, (_, i) => ({ promptId: `q${i}`, prompt: `Question ${i}`, responses: [{ responseId: 'a', text: 'A' }, { responseId: 'b', text: 'B' }], priority: i % 7 })),
      });
    }, 120_000);
    afterAll(async () => {
      if (second !== store) await second.close();
      await store.close();
      await factory.cleanup();
    });

    it(`submits exactly ${ITEMS * REQUIRED} reviews: none lost or duplicated, no item over-assigned, every item decided`, async () => {
      let maxLive = 0;
      const work = reviewers.map(async (reviewerId, r) => {
        const instance = r % 2 === 0 ? store : second;
        let done = 0;
        for (;;) {
          const claim = await claimNext(instance, reviewerId);
          if (!claim) return done;
          // claims plus reviews of this item, in one statement (one snapshot)
          const { n } = await sql<{ n: number }>`select (select count(*) from work_claims where item_id = ${claim.itemId}) + (select count(*) from reviews where item_id = ${claim.itemId}) as n`.execute(instance.db).then((r) => r.rows[0]);
          maxLive = Math.max(maxLive, Number(n));
          const ranking = r % 3 === 0 ? { a: 2, b: 1 } : { a: 1, b: 2 };
          await submitReview(instance, { itemId: claim.itemId, reviewerId, status: 'submitted', displayOrder: ['a', 'b'], firstRanking: ranking, finalRanking: ranking, rationale: 'Load test ranking with a rationale.', startedAt: new Date().toISOString(), timeSpentMs: 1 });
          done++;
        }
      });
      const counts = await Promise.all(work);
      expect(counts.reduce((a, b) => a + b, 0)).toBe(ITEMS * REQUIRED);
      expect(maxLive).toBeLessThanOrEqual(REQUIRED);
      const reviews = await store.db.selectFrom('reviews').select(['item_id', 'reviewer_id']).execute();
      expect(reviews).toHaveLength(ITEMS * REQUIRED);
      expect(new Set(reviews.map((r) => `${r.item_id}:${r.reviewer_id}`)).size).toBe(ITEMS * REQUIRED);
      const perItem = new Map<number, number>();
      for (const r of reviews) perItem.set(r.item_id, (perItem.get(r.item_id) ?? 0) + 1);
      expect([...perItem.values()].every((n) => n === REQUIRED)).toBe(true);
      const states = await store.db.selectFrom('items').select((eb) => ['state', eb.fn.countAll<number>().as('n')]).groupBy('state').execute();
      const byState = Object.fromEntries(states.map((s) => [s.state, Number(s.n)]));
      expect((byState.final ?? 0) + (byState.adjudication ?? 0)).toBe(ITEMS);
      expect(byState.in_review ?? 0).toBe(0);
      expect(Number((await store.db.selectFrom('work_claims').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow()).n)).toBe(0);
    }, 300_000);
  });
}
