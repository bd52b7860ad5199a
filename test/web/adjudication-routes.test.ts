import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqliteFactory } from '../helpers/stores.ts';
import { ORIGIN, seededApp, signIn } from '../helpers/web.ts';
import { createUser } from '../../src/store/repos/users.ts';
import type { Store } from '../../src/store/connect.ts';

const factory = sqliteFactory();
let store: Store;
let app: Awaited<ReturnType<typeof seededApp>>;

beforeAll(async () => {
  store = await factory.open();
  app = await seededApp(store);
  await createUser(store.db, { username: 'adjudicator2', displayName: 'Second Adjudicator', password: 'test-adjudicator2-pw', roles: ['adjudicator'] });
});
afterAll(async () => {
  await store.close();
  await factory.cleanup();
});

const decide = (session: { cookie: string; csrf: string }, itemId: number, ranks: Record<string, string>, rationale: string) =>
  app.request(`/adjudicate/${itemId}`, { method: 'POST', headers: { cookie: session.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: session.csrf, ...ranks, rationale }) });

describe('adjudication', () => {
  it('lists the items whose reviewers disagree, and shows every ranking and rationale side by side', async () => {
    const adj = await signIn(app, 'adjudicator');
    const list = await (await app.request('/adjudicate', { headers: { cookie: adj.cookie } })).text();
    expect(list).toContain('cf-001');
    expect(list).toContain('reviewers disagree');
    const item = await store.db.selectFrom('items').select('id').where('prompt_id', '=', 'cf-001').executeTakeFirstOrThrow();
    const page = await (await app.request(`/adjudicate/${item.id}`, { headers: { cookie: adj.cookie } })).text();
    expect(page).toContain('<th scope="col">Ines Calloway (demo reviewer)</th>');
    expect(page).toContain('<th scope="col">Tobin Reyes (demo reviewer)</th>');
    expect(page).toContain('B explains the carbon monoxide risk');
  });

  it('records the final ranking once; a second adjudicator gets a clear conflict and nothing is overwritten', async () => {
    const item = await store.db.selectFrom('items').select('id').where('prompt_id', '=', 'cf-028').executeTakeFirstOrThrow();
    const ranks = { rank_a: '1', rank_b: '4', rank_c: '5', rank_d: '2', rank_e: '3' };
    const first = await signIn(app, 'adjudicator');
    const bad = await decide(first, item.id, { ...ranks, rank_e: '9' }, 'A and D both warn clearly; D is kinder.');
    expect(bad.status).toBe(422);
    expect(await bad.text()).toMatch(/Not recorded: ranking: rank of e must be a whole number from 1 to 5/);
    const ok = await decide(first, item.id, ranks, 'A and D both warn clearly; A is more complete.');
    expect(ok.status).toBe(303);
    const page = await app.request('/login');
    const cookie = (page.headers.getSetCookie()[0] ?? '').split(';')[0];
    const csrf = (await page.text()).match(/name="_csrf" value="([^"]+)"/)![1];
    const login = await app.request('/login', { method: 'POST', headers: { cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: csrf, username: 'adjudicator2', password: 'test-adjudicator2-pw' }) });
    const session = login.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
    const home = await (await app.request('/', { headers: { cookie: session } })).text();
    const adj2 = { cookie: session, csrf: home.match(/name="csrf-token" content="([^"]+)"/)![1] };
    const late = await decide(adj2, item.id, { ...ranks, rank_a: '2', rank_d: '1' }, 'D first: same warning, kinder tone.');
    expect(late.status).toBe(409);
    expect(await late.text()).toMatch(/already decided by Maren Voss \(demo adjudicator\) at .* your decision was not saved/);
    const decision = await store.db.selectFrom('adjudications').selectAll().where('item_id', '=', item.id).execute();
    expect(decision).toHaveLength(1);
    expect(JSON.parse(decision[0].ranking)).toMatchObject({ a: 1, d: 2 });
  });

  it('is for adjudicators only', async () => {
    const reviewer = await signIn(app, 'reviewer');
    expect((await app.request('/adjudicate', { headers: { cookie: reviewer.cookie } })).status).toBe(403);
  });
});
