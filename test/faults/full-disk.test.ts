import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importBatch } from '../../src/io/import-batch.ts';
import { loadRubricFile } from '../../src/rubric/load.ts';
import { storageFailure } from '../../src/store/storage-failure.ts';
import type { Store } from '../../src/store/connect.ts';
import { sqliteFactory } from '../helpers/stores.ts';
import { ORIGIN, seededApp, signIn } from '../helpers/web.ts';

const TABLES = ['batches', 'items', 'responses', 'scores', 'reviews', 'adjudications', 'rubric_versions', 'work_claims'] as const;
const rubric = loadRubricFile(new URL('../../rubrics/general.yaml', import.meta.url).pathname).rubric!;

/**
 * A full disk, simulated with SQLite's max_page_count: the database may not grow by a single
 * page. Every write that needs room must fail with a message a person can act on, and leave
 * every table exactly as it was.
 */
describe('a full disk (SQLite at its max_page_count)', () => {
  const factory = sqliteFactory();
  let store: Store;
  let app: Awaited<ReturnType<typeof seededApp>>;
  let big: string;
  const counts = async () => Object.fromEntries(await Promise.all(TABLES.map(async (t) => [t, Number((await store.db.selectFrom(t).select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow()).n)])));
  const setLimit = async (pages: number | null) => {
    const { rows } = await sql<{ page_count: number }>`pragma page_count`.execute(store.db);
    await sql.raw(`pragma max_page_count = ${pages ?? 1_073_741_823}`).execute(store.db);
    return Number(rows[0].page_count);
  };

  beforeAll(async () => {
    store = await factory.open();
    app = await seededApp(store);
    big = join(store.where, '..', 'big.jsonl');
    writeFileSync(big, Array.from({ length: 200 }, (_, i) => JSON.stringify({ prompt_id: `full-${i}`, prompt: `Question ${i}?`, responses: [{ response_id: 'a', text: 'A long answer. '.repeat(80) }, { response_id: 'b', text: 'Another long answer. '.repeat(80) }] })).join('\n'));
  });
  afterAll(async () => {
    await store.close();
    await factory.cleanup();
  });

  it('refuses an import with a clear message and stores none of it; with room again, the same file imports whole', async () => {
    const before = await counts();
    await setLimit((await setLimit(null)));
    const error = await importBatch(store, { path: big, batchName: 'too big', rubric, scoreThreads: 0 }).catch((e) => e);
    expect(storageFailure(error)).toMatchObject({ kind: 'full' });
    expect(storageFailure(error)!.message).toMatch(/The database is full .* Nothing of this action was saved, and nothing already stored was lost/);
    expect(await counts()).toEqual(before);
    expect((await sql<{ integrity_check: string }>`pragma integrity_check`.execute(store.db)).rows[0].integrity_check).toBe('ok');
    await setLimit(null);
    const result = await importBatch(store, { path: big, batchName: 'too big', rubric, scoreThreads: 0 });
    expect(result.items).toBe(200);
  });

  it('answers a review submitted to a full database with 503 and the reason, keeping what was stored', async () => {
    const reviewer = await signIn(app, 'reviewer');
    const next = await app.request('/review/next', { headers: { cookie: reviewer.cookie } });
    const path = next.headers.get('location')!;
    const page = await (await app.request(path, { headers: { cookie: reviewer.cookie } })).text();
    const ranks = Object.fromEntries([...page.matchAll(/name="(rank_[^"]+)"/g)].map((m, i) => [m[1], String(i + 1)]));
    const before = await counts();
    await setLimit(await setLimit(null));
    const submit = () => app.request(`${path}/submit`, { method: 'POST', headers: { cookie: reviewer.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: reviewer.csrf, ...ranks, rationale: 'A careful reason. '.repeat(2000), started_at: new Date().toISOString() }) });
    const res = await submit();
    expect(res.status).toBe(503);
    expect(await res.text()).toContain('The database is full');
    expect(await counts()).toEqual(before);
    await setLimit(null);
    expect((await submit()).status).toBe(303);
    expect((await counts()).reviews).toBe(before.reviews + 1);
  });

  it('ends a web import on a full database with the reason on its page, storing nothing', async () => {
    const data = await signIn(app, 'data');
    const before = await counts();
    await setLimit(await setLimit(null));
    const body = new FormData();
    for (const [k, v] of Object.entries({ _csrf: data.csrf, name: 'full from the web', rubric: 'general' })) body.set(k, v);
    body.set('file', new File([Array.from({ length: 100 }, (_, i) => JSON.stringify({ prompt_id: `w${i}`, prompt: `Q${i}?`, responses: [{ response_id: 'a', text: 'Answer. '.repeat(100) }, { response_id: 'b', text: 'Other. '.repeat(100) }] })).join('\n')], 'full.jsonl'));
    const upload = await app.request('/batches/import', { method: 'POST', headers: { cookie: data.cookie, origin: ORIGIN }, body });
    expect(upload.status).toBe(303);
    let panel = '';
    for (let i = 0; i < 400 && (panel === '' || panel.includes('hx-trigger')); i++) {
      await new Promise((r) => setTimeout(r, 25));
      panel = await (await app.request(`${upload.headers.get('location')}/progress`, { headers: { cookie: data.cookie } })).text();
    }
    expect(panel).toContain('The import stopped and stored nothing: The database is full');
    await setLimit(null);
    expect(await counts()).toEqual(before);
  });
});
