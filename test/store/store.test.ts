import { afterAll, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { migrate, migrationStatus, latestMigration } from '../../src/store/migrate.ts';
import { storeBatch, listBatches, type NewBatch } from '../../src/store/repos/batches.ts';
import { listQueue, countItemsByState } from '../../src/store/repos/queue.ts';
import { createUser, findUserByName } from '../../src/store/repos/users.ts';
import { verifyPassword } from '../../src/auth/password.ts';
import { seedDemo, DEMO_USERS } from '../../src/demo/seed.ts';
import { cairnfieldItems } from '../../src/demo/cairnfield-items.ts';
import { storeFactories } from '../helpers/stores.ts';

function batch(name: string, hash: string, items: NewBatch['items']): NewBatch {
  return { name, sourceHash: hash, sourceName: `${name}.jsonl`, items };
}

const twoItems: NewBatch['items'] = [
  { promptId: 'p1', prompt: 'First prompt', responses: [{ responseId: 'a', text: 'A' }, { responseId: 'b', text: 'B' }], priority: 1 },
  { promptId: 'p2', prompt: 'Second prompt', flag: { reason: 'pii', severity: 'high' }, responses: [{ responseId: 'a', text: 'A2' }, { responseId: 'b', text: 'B2' }], priority: 3 },
];

for (const factory of storeFactories()) {
  describe(`store on ${factory.kind}`, () => {
    afterAll(() => factory.cleanup());

    it('applies every migration and reports them applied', async () => {
      const store = await factory.open();
      await migrate(store);
      const status = await migrationStatus(store);
      expect(status.map((m) => m.name)).toEqual(['0001-core', '0002-review-workflow', '0003-login-failures', '0004-queue-filters']);
      expect(status.every((m) => m.executedAt !== null)).toBe(true);
      expect(latestMigration).toBe('0004-queue-filters');
      // a second run is a no-op
      expect(await migrate(store)).toEqual([]);
      await store.close();
    });

    it('upgrades a database built at the older migration in place, keeping its rows', async () => {
      const store = await factory.open();
      await migrate(store, '0001-core');
      expect((await migrationStatus(store)).map((m) => Boolean(m.executedAt))).toEqual([true, false, false, false]);
      const userId = await createUser(store.db, { username: 'old', displayName: 'Old User', password: 'pw-old-1', roles: ['reviewer'] });
      await storeBatch(store.db, batch('old-batch', 'hash-old', twoItems));
      await migrate(store);
      expect((await migrationStatus(store)).every((m) => m.executedAt)).toBe(true);
      expect((await findUserByName(store.db, 'old'))?.id).toBe(userId);
      expect(await listBatches(store.db)).toMatchObject([{ name: 'old-batch', items: 2, final: 0 }]);
      // the tables 0002 adds are usable
      await store.db.insertInto('work_claims').values({ item_id: 1, user_id: userId, claimed_at: 'x', expires_at: 'y' }).execute();
      // and the columns 0004 adds have their defaults on the old rows
      expect((await store.db.selectFrom('batches').select('rationale_min').executeTakeFirstOrThrow()).rationale_min).toBe(20);
      await store.close();
    });

    it('stores a batch whole and lists its items in triage order', async () => {
      const store = await factory.open();
      await migrate(store);
      const { itemIds } = await storeBatch(store.db, batch('b1', 'h1', twoItems));
      expect(itemIds).toHaveLength(2);
      const queue = await listQueue(store.db);
      expect(queue.map((r) => r.prompt_id)).toEqual(['p2', 'p1']);
      expect(queue[0]).toMatchObject({ batch_name: 'b1', flag_severity: 'high', responses: 2, reviews: 0, reviews_required: 1, state: 'open' });
      expect(await countItemsByState(store.db)).toMatchObject({ open: 2, final: 0 });
      await store.close();
    });

    it('refuses the same file twice and stores nothing new', async () => {
      const store = await factory.open();
      await migrate(store);
      await storeBatch(store.db, batch('first', 'same-hash', twoItems));
      await expect(storeBatch(store.db, batch('second', 'same-hash', twoItems))).rejects.toThrow(/already imported as batch "first"/);
      expect((await listBatches(store.db)).map((b) => b.name)).toEqual(['first']);
      await store.close();
    });

    it('rolls back a batch that fails half-way: no batch, item or response is left', async () => {
      const store = await factory.open();
      await migrate(store);
      const broken = [...twoItems, { promptId: 'p3', prompt: 'dup ids', responses: [{ responseId: 'x', text: '1' }, { responseId: 'x', text: '2' }] }];
      await expect(storeBatch(store.db, batch('broken', 'h-broken', broken))).rejects.toThrow();
      for (const table of ['batches', 'items', 'responses', 'audit_events'] as const) {
        const { n } = await store.db.selectFrom(table).select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow();
        expect(Number(n), table).toBe(0);
      }
      await store.close();
    });

    it('seeds the demo once: a second seed writes nothing', async () => {
      const store = await factory.open();
      await migrate(store);
      const first = await seedDemo(store.db, { password: (u) => `pw-${u}-demo` });
      expect(first.seeded).toBe(true);
      expect(first.logins.map((l) => l.username)).toEqual(DEMO_USERS.map((u) => u.username));
      const second = await seedDemo(store.db);
      expect(second).toEqual({ seeded: false, logins: [] });
      const counts = await store.db.selectFrom('items').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow();
      expect(Number(counts.n)).toBe(cairnfieldItems.length);
      const responses = await store.db.selectFrom('responses').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow();
      expect(Number(responses.n)).toBe(cairnfieldItems.reduce((n, i) => n + i.responses.length, 0));
      const states = await countItemsByState(store.db);
      expect(states.final).toBeGreaterThanOrEqual(5);
      expect(states.adjudication).toBeGreaterThanOrEqual(1);
      expect(states.in_review).toBeGreaterThanOrEqual(1);
      const admin = await findUserByName(store.db, 'admin');
      expect(await verifyPassword('pw-admin-demo', admin!.password_hash)).toBe(true);
      expect(await verifyPassword('wrong', admin!.password_hash)).toBe(false);
      await store.close();
    });
  });
}
