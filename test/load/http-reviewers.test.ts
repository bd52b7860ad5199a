import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { migrate } from '../../src/store/migrate.ts';
import { storeBatch } from '../../src/store/repos/batches.ts';
import { createUser } from '../../src/store/repos/users.ts';
import { claimNext } from '../../src/review/workflow.ts';
import { startServer, type RunningServer } from '../../src/web/server.ts';
import type { Store } from '../../src/store/connect.ts';
import { storeFactories } from '../helpers/stores.ts';
import { HttpUser } from '../helpers/http-user.ts';

const REVIEWERS = 50;
const ITEMS = 1000;
const REQUIRED = 2;
/** Items whose first claims are abandoned and expire: they must come back to the queue. */
const ABANDONED = 20;
const PASSWORD = 'pw-http-load-1';
const RATIONALE = 'Ranked over HTTP by a simulated reviewer.';

for (const factory of storeFactories()) {
  describe(`${REVIEWERS} reviewers over HTTP on ${factory.kind}${factory.kind === 'postgres' ? ', two app instances sharing the database' : ''}`, () => {
    let store: Store;
    let second: Store;
    const servers: RunningServer[] = [];

    beforeAll(async () => {
      store = await factory.open();
      await migrate(store);
      second = factory.kind === 'postgres' ? await factory.openAgain() : store;
      servers.push(await startServer(store, { host: '127.0.0.1', port: 0 }));
      if (second !== store) servers.push(await startServer(second, { host: '127.0.0.1', port: 0 }));
      for (let i = 0; i < REVIEWERS; i++) await createUser(store.db, { username: `web${i}`, displayName: `Web reviewer ${i}`, password: PASSWORD, roles: ['reviewer'] });
      await storeBatch(store.db, {
        name: 'http load', sourceHash: 'http-load', sourceName: 'http-load.jsonl', reviewsRequired: REQUIRED, consensusRule: { kind: 'top' },
        items: Array.from({ length: ITEMS }, (_, i) => ({ promptId: `h${i}`, prompt: `Question ${i}`, responses: [{ responseId: 'a', text: 'A' }, { responseId: 'b', text: 'B' }], priority: i % 5 })),
      });
      // people who opened an item two minutes ago and walked away: their one-minute claims have run out
      for (let g = 0; g < ABANDONED; g++) {
        const ghost = await createUser(store.db, { username: `ghost${g}`, displayName: `Ghost ${g}`, password: PASSWORD, roles: ['reviewer'] });
        await claimNext(store, ghost, { ttlMs: 60_000, now: Date.now() - 120_000 });
      }
    }, 180_000);
    afterAll(async () => {
      for (const s of servers) await s.close();
      if (second !== store) await second.close();
      await store.close();
      await factory.cleanup();
    });

    it(`submits exactly ${ITEMS * REQUIRED} reviews: none lost or duplicated, no item over-assigned, every expired claim returned`, async () => {
      const claims = (await store.db.selectFrom('work_claims').select('item_id').execute()).map((c) => c.item_id);
      expect(claims).toHaveLength(ABANDONED);
      const abandoned = [...new Set(claims)];
      expect(abandoned).toHaveLength(ABANDONED / REQUIRED); // each item took two of them, as many as it needs
      const reviewers = Array.from({ length: REVIEWERS }, (_, r) => new HttpUser(servers[r % servers.length].url, `web${r}`, PASSWORD));
      for (const r of reviewers) await r.signIn();
      let maxLive = 0;
      const failures: string[] = [];
      const work = reviewers.map(async (reviewer, r) => {
        let done = 0;
        for (;;) {
          const next = await reviewer.get('/review/next');
          if (next.status === 200) return done; // nothing waiting
          if (next.status !== 303) {
            failures.push(`${reviewer.username} next: ${next.status}`);
            return done;
          }
          const path = next.headers.get('location')!;
          const itemId = Number(path.split('/').pop());
          // claims plus reviews of this item, in one statement (one snapshot)
          const { n } = await sql<{ n: number }>`select (select count(*) from work_claims where item_id = ${itemId} and expires_at > ${new Date().toISOString()}) + (select count(*) from reviews where item_id = ${itemId}) as n`.execute(store.db).then((x) => x.rows[0]);
          maxLive = Math.max(maxLive, Number(n));
          const page = await (await reviewer.get(path)).text();
          const startedAt = page.match(/name="started_at" value="([^"]+)"/)![1];
          const ranks = r % 3 === 0 ? { rank_a: '2', rank_b: '1' } : { rank_a: '1', rank_b: '2' };
          const submitted = await reviewer.post(`${path}/submit`, { ...ranks, rationale: RATIONALE, started_at: startedAt });
          if (submitted.status !== 303) failures.push(`${reviewer.username} submit ${itemId}: ${submitted.status}`);
          else done++;
        }
      });
      const counts = await Promise.all(work);
      expect(failures).toEqual([]);
      expect(counts.reduce((a, b) => a + b, 0)).toBe(ITEMS * REQUIRED);
      expect(maxLive).toBeLessThanOrEqual(REQUIRED);
      const reviews = await store.db.selectFrom('reviews').select(['item_id', 'reviewer_id']).execute();
      expect(reviews).toHaveLength(ITEMS * REQUIRED);
      expect(new Set(reviews.map((x) => `${x.item_id}:${x.reviewer_id}`)).size).toBe(ITEMS * REQUIRED);
      const perItem = new Map<number, number>();
      for (const x of reviews) perItem.set(x.item_id, (perItem.get(x.item_id) ?? 0) + 1);
      expect(perItem.size).toBe(ITEMS);
      expect([...perItem.values()].every((n) => n === REQUIRED)).toBe(true);
      // the abandoned items came back and were reviewed in full
      for (const itemId of abandoned) expect(perItem.get(itemId)).toBe(REQUIRED);
      const states = await store.db.selectFrom('items').select((eb) => ['state', eb.fn.countAll<number>().as('n')]).groupBy('state').execute();
      const byState = Object.fromEntries(states.map((s) => [s.state, Number(s.n)]));
      expect((byState.final ?? 0) + (byState.adjudication ?? 0)).toBe(ITEMS);
      expect(Number((await store.db.selectFrom('work_claims').select(sql<number>`count(*)`.as('n')).where('expires_at', '>', new Date().toISOString()).executeTakeFirstOrThrow()).n)).toBe(0);
    }, 600_000);
  });
}
