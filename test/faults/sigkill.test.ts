import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { ChildProcess } from 'node:child_process';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openStore, type Store } from '../../src/store/connect.ts';
import { migrate } from '../../src/store/migrate.ts';
import { seedDemo } from '../../src/demo/seed.ts';
import { storeBatch } from '../../src/store/repos/batches.ts';
import { createUser } from '../../src/store/repos/users.ts';
import { startServe } from '../helpers/cli.ts';
import { HttpUser } from '../helpers/http-user.ts';
import { sqliteFactory } from '../helpers/stores.ts';
import { demoPassword } from '../helpers/web.ts';

const REVIEWERS = 12;
const ITEMS = 150;
const PASSWORD = 'pw-kill-test-1';
const RATIONALE = 'Ranked while the server might be killed.';

/** SIGKILL: no shutdown handler runs, as when the machine loses power or the process is killed. */
function kill(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    child.removeAllListeners('exit');
    child.once('exit', () => resolve());
    child.kill('SIGKILL');
  });
}

/**
 * The server killed with SIGKILL in the middle of an import and of a burst of submissions,
 * then started again on the same SQLite file: the database is consistent, no batch is half
 * stored, every acknowledged review is there, and the work can be finished.
 */
describe('the server killed with SIGKILL and started again', () => {
  const factory = sqliteFactory();
  let dbFile: string;
  let dir: string;
  let server: { child: ChildProcess; url: string; output: () => string };

  const withStore = async <T>(f: (store: Store) => Promise<T>): Promise<T> => {
    const store = await openStore({ kind: 'sqlite', file: dbFile });
    try {
      return await f(store);
    } finally {
      await store.close();
    }
  };
  const count = (store: Store, table: 'items' | 'batches' | 'responses' | 'scores' | 'reviews') => store.db.selectFrom(table).select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow().then((r) => Number(r.n));
  const start = async () => (server = await startServe({ cwd: dir, env: { PLUMBLINE_DB: dbFile } }));

  beforeAll(async () => {
    const store = await factory.open();
    dbFile = store.where;
    dir = join(dbFile, '..');
    await migrate(store);
    await seedDemo(store.db, { password: demoPassword });
    for (let i = 0; i < REVIEWERS; i++) await createUser(store.db, { username: `kill${i}`, displayName: `Kill test ${i}`, password: PASSWORD, roles: ['reviewer'] });
    await storeBatch(store.db, {
      name: 'kill burst', sourceHash: 'kill-burst', sourceName: 'kill.jsonl', reviewsRequired: 2, consensusRule: { kind: 'top' },
      items: Array.from({ length: ITEMS }, (_, i) => ({ promptId: `k${i}`, prompt: `Kill question ${i}`, responses: [{ responseId: 'a', text: 'A' }, { responseId: 'b', text: 'B' }], priority: 1000 + (i % 3) })),
    });
    await store.close();
    await start();
  }, 60_000);
  afterAll(async () => {
    if (server.child.exitCode === null && server.child.signalCode === null) await kill(server.child);
    await factory.cleanup();
  });

  it('during an import: nothing of the batch is stored, and importing the file again stores it once', async () => {
    const prompts = 5000;
    const file = Array.from({ length: prompts }, (_, i) => JSON.stringify({ prompt_id: `imp-${i}`, prompt: `How should I dry boots, case ${i}?`, responses: [{ response_id: 'a', text: 'Slowly, away from the stove, with newspaper inside. '.repeat(4) }, { response_id: 'b', text: 'On the stove. Never leave them. '.repeat(4) }, { response_id: 'c', text: 'I cannot help with that.' }] })).join('\n');
    const before = await withStore(async (s) => ({ items: await count(s, 'items'), batches: await count(s, 'batches'), responses: await count(s, 'responses'), scores: await count(s, 'scores') }));
    const upload = async () => {
      const data = new HttpUser(server.url, 'data', demoPassword('data'));
      await data.signIn();
      const body = new FormData();
      body.set('_csrf', data.csrf);
      body.set('name', 'killed import');
      body.set('file', new File([file], 'killed.jsonl'));
      const res = await fetch(`${server.url}/batches/import`, { method: 'POST', redirect: 'manual', headers: { cookie: data.cookie, origin: server.url }, body });
      expect(res.status).toBe(303);
      return { data, page: res.headers.get('location')! };
    };
    const progress = async (data: HttpUser, page: string) => (await data.get(`${page}/progress`)).text();

    const first = await upload();
    // wait until items are being stored and scored, then kill
    for (let i = 0; i < 600; i++) {
      const panel = await progress(first.data, first.page);
      if (/Storing and scoring: [1-9][\d,]* of/.test(panel)) break;
      if (i === 599) throw new Error(`the import never reached storing: ${panel}`);
      await new Promise((r) => setTimeout(r, 50));
    }
    await kill(server.child);
    await withStore(async (s) => {
      expect((await sql<{ integrity_check: string }>`pragma integrity_check`.execute(s.db)).rows[0].integrity_check).toBe('ok');
      // what the killed import stored is staged: no list, queue or count shows it
      const staged = await s.db.selectFrom('items').select(sql<number>`count(*)`.as('n')).where('state', '=', 'staged').executeTakeFirstOrThrow();
      expect(Number(staged.n)).toBeGreaterThan(0);
      expect(await s.db.selectFrom('batches').select('name').where('import_owner', 'is', null).execute()).toHaveLength(before.batches);
    });
    await start(); // removes the unfinished import before serving
    expect(server.output()).toContain('Removed batch "killed import": its import stopped part-way');
    await withStore(async (s) => {
      expect({ items: await count(s, 'items'), batches: await count(s, 'batches'), responses: await count(s, 'responses'), scores: await count(s, 'scores') }).toEqual(before);
    });

    const second = await upload();
    let panel = '';
    for (let i = 0; i < 1800 && !panel.includes('Imported'); i++) {
      await new Promise((r) => setTimeout(r, 100));
      panel = await progress(second.data, second.page);
    }
    expect(panel).toContain(`Imported &quot;killed import&quot;: ${prompts.toLocaleString('en')} prompts`);
    const third = await upload();
    for (let i = 0; i < 200 && !panel.includes('already imported'); i++) {
      await new Promise((r) => setTimeout(r, 50));
      panel = await progress(third.data, third.page);
    }
    expect(panel).toContain('was already imported as batch');
    await withStore(async (s) => {
      expect(await count(s, 'items')).toBe(before.items + prompts);
      expect(await count(s, 'batches')).toBe(before.batches + 1);
      expect(await count(s, 'responses')).toBe(before.responses + 3 * prompts);
    });
  }, 300_000);

  it('during a burst of submissions: every acknowledged review is stored, states agree with reviews, and the work finishes exactly', async () => {
    const batchId = await withStore(async (s) => (await s.db.selectFrom('batches').select('id').where('name', '=', 'kill burst').executeTakeFirstOrThrow()).id);
    const acknowledged: string[] = [];
    const reviewers = Array.from({ length: REVIEWERS }, (_, i) => new HttpUser(server.url, `kill${i}`, PASSWORD));
    for (const r of reviewers) await r.signIn();
    let stop = false;
    const burst = reviewers.map(async (r) => {
      while (!stop) {
        const result = await r.reviewNext(RATIONALE, batchId).catch(() => null); // the connection dies with the server
        if (!result) return;
        if (result.status === 303) acknowledged.push(`${result.itemId}:${r.username}`);
      }
    });
    while (acknowledged.length < 60) await new Promise((r) => setTimeout(r, 10));
    await kill(server.child);
    stop = true;
    await Promise.all(burst);

    const check = (s: Store) => withConsistency(s, batchId);
    await withStore(async (s) => {
      const stored = await s.db.selectFrom('reviews').innerJoin('users', 'users.id', 'reviews.reviewer_id').innerJoin('items', 'items.id', 'reviews.item_id').select(['reviews.item_id', 'users.username']).where('items.batch_id', '=', batchId).execute();
      const keys = new Set(stored.map((x) => `${x.item_id}:${x.username}`));
      for (const a of acknowledged) expect(keys.has(a), a).toBe(true);
      expect(keys.size).toBe(stored.length); // no duplicates
      await check(s);
    });

    await start();
    const again = Array.from({ length: REVIEWERS }, (_, i) => new HttpUser(server.url, `kill${i}`, PASSWORD));
    for (const r of again) await r.signIn();
    await Promise.all(again.map(async (r) => {
      for (;;) {
        const result = await r.reviewNext(RATIONALE, batchId);
        if (!result) return;
        expect(result.status).toBe(303);
      }
    }));
    await withStore(async (s) => {
      const reviews = await s.db.selectFrom('reviews').innerJoin('items', 'items.id', 'reviews.item_id').select(['reviews.item_id', 'reviews.reviewer_id']).where('items.batch_id', '=', batchId).where('reviews.status', '=', 'submitted').execute();
      expect(reviews).toHaveLength(ITEMS * 2);
      expect(new Set(reviews.map((x) => `${x.item_id}:${x.reviewer_id}`)).size).toBe(ITEMS * 2);
      await check(s);
      const open = await s.db.selectFrom('items').select('id').where('batch_id', '=', batchId).where('state', 'in', ['open', 'in_review']).execute();
      expect(open).toEqual([]);
    });
  }, 240_000);
});

/** Every item's state agrees with its reviews and decision. */
async function withConsistency(store: Store, batchId: number): Promise<void> {
  const items = await store.db.selectFrom('items').select(['id', 'state']).where('batch_id', '=', batchId).execute();
  const reviews = await store.db.selectFrom('reviews').innerJoin('items', 'items.id', 'reviews.item_id').select(['reviews.item_id']).where('items.batch_id', '=', batchId).where('reviews.status', '=', 'submitted').execute();
  const decided = new Set((await store.db.selectFrom('adjudications').innerJoin('items', 'items.id', 'adjudications.item_id').select('adjudications.item_id').where('items.batch_id', '=', batchId).execute()).map((d) => d.item_id));
  const perItem = new Map<number, number>();
  for (const r of reviews) perItem.set(r.item_id, (perItem.get(r.item_id) ?? 0) + 1);
  for (const item of items) {
    const n = perItem.get(item.id) ?? 0;
    const expected = n === 0 ? ['open'] : n === 1 ? ['in_review'] : ['final', 'adjudication'];
    expect(expected, `item ${item.id} with ${n} review(s) is ${item.state}`).toContain(item.state);
    expect(decided.has(item.id), `item ${item.id} decision`).toBe(item.state === 'final');
  }
}
