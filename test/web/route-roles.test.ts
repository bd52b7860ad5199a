import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { sqliteFactory } from '../helpers/stores.ts';
import { ORIGIN, seededApp, signIn } from '../helpers/web.ts';
import type { Store } from '../../src/store/connect.ts';

const factory = sqliteFactory();
let store: Store;
let app: Awaited<ReturnType<typeof seededApp>>;
const sessions: Record<string, { cookie: string; csrf: string }> = {};
const USERS = ['reviewer', 'adjudicator', 'policy', 'data', 'admin'] as const;
let itemId = 0;
let batchId = 0;
let rubricSource = '';

beforeAll(async () => {
  store = await factory.open();
  app = await seededApp(store);
  for (const u of USERS) sessions[u] = await signIn(app, u);
  itemId = (await store.db.selectFrom('items').select('id').executeTakeFirstOrThrow()).id;
  batchId = (await store.db.selectFrom('batches').select('id').executeTakeFirstOrThrow()).id;
  rubricSource = (await store.db.selectFrom('rubric_versions').select('content').executeTakeFirstOrThrow()).content;
});
afterAll(async () => {
  await store.close();
  await factory.cleanup();
});

type Route = { method: 'GET' | 'POST'; path: () => string; allowed: readonly (typeof USERS)[number][]; body?: () => Record<string, string> };
const ALL = USERS;
const READERS = ['adjudicator', 'policy', 'data', 'admin'] as const;
const routes: Route[] = [
  { method: 'GET', path: () => '/', allowed: ALL },
  { method: 'GET', path: () => `/items/${itemId}`, allowed: ALL },
  { method: 'GET', path: () => '/batches', allowed: ['policy', 'data', 'admin'] },
  { method: 'GET', path: () => '/review/next', allowed: ['reviewer', 'adjudicator'] },
  { method: 'GET', path: () => '/adjudicate', allowed: ['adjudicator'] },
  { method: 'GET', path: () => '/export?format=rankings', allowed: ['data', 'admin'] },
  { method: 'GET', path: () => '/rubrics', allowed: READERS },
  { method: 'GET', path: () => '/rubrics/cairnfield-support', allowed: READERS },
  { method: 'GET', path: () => '/rubrics/cairnfield-support/edit', allowed: ['policy'] },
  { method: 'GET', path: () => `/stats?batch=${batchId}`, allowed: READERS },
  { method: 'GET', path: () => '/admin/audit', allowed: ['admin'] },
  { method: 'GET', path: () => '/admin/audit.jsonl', allowed: ['admin'] },
  { method: 'GET', path: () => '/admin/tokens', allowed: ['admin'] },
  { method: 'GET', path: () => '/admin/users', allowed: ['admin'] },
  { method: 'POST', path: () => '/admin/users', allowed: ['admin'], body: () => ({ username: `role${Date.now() % 100000}`, roles: 'reviewer' }) },
  { method: 'POST', path: () => '/admin/tokens', allowed: ['admin'], body: () => ({ name: 'role test', scopes: 'export' }) },
  { method: 'POST', path: () => '/rubrics/validate', allowed: ['policy'], body: () => ({ source: rubricSource }) },
  { method: 'POST', path: () => '/rubrics/cairnfield-support/preview', allowed: ['policy'], body: () => ({ source: rubricSource, batch: String(batchId) }) },
  { method: 'POST', path: () => '/rubrics/cairnfield-support/draft', allowed: ['policy'], body: () => ({ source: rubricSource }) },
  { method: 'POST', path: () => '/rubrics/cairnfield-support/publish', allowed: ['policy'], body: () => ({ source: rubricSource.replace('title:', '# changed\ntitle:').replace('weight: 4', 'weight: 5'), note: 'role test' }) },
  { method: 'POST', path: () => '/stats/weights', allowed: ['policy'], body: () => ({ batch: String(batchId) }) },
];

async function changeCounts() {
  const n = async (table: 'rubric_versions' | 'sessions' | 'users' | 'batches' | 'api_tokens') => Number((await store.db.selectFrom(table).select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow()).n);
  return { rubric_versions: await n('rubric_versions'), users: await n('users'), batches: await n('batches'), api_tokens: await n('api_tokens') };
}

function request(route: Route, who: (typeof USERS)[number] | null) {
  const session = who ? sessions[who] : null;
  const headers: Record<string, string> = { origin: ORIGIN };
  if (session) headers.cookie = session.cookie;
  if (route.method === 'GET') return app.request(route.path(), { headers });
  return app.request(route.path(), { method: 'POST', headers: { ...headers, 'content-type': 'application/x-www-form-urlencoded', ...(session ? { 'x-csrf-token': session.csrf } : {}) }, body: new URLSearchParams(route.body?.() ?? {}) });
}

describe('every route × every role', () => {
  for (const route of routes) {
    for (const who of [...USERS, null]) {
      const allowed = who !== null && route.allowed.includes(who);
      it(`${route.method} ${route.path.toString().replace(/^\(\) => /, '').replace(/[`']/g, '')} as ${who ?? 'a visitor'} → ${allowed ? 'allowed' : who ? '403' : 'sign in or 403'}`, async () => {
        const before = await changeCounts();
        const res = await request(route, who);
        if (allowed) expect([200, 201, 303], await res.clone().text().then((t) => t.slice(0, 200))).toContain(res.status);
        else if (who) {
          expect(res.status).toBe(403);
          expect(await changeCounts()).toEqual(before);
        } else if (route.method === 'GET') {
          expect(res.status).toBe(303);
          expect(res.headers.get('location')).toMatch(/^\/login\?next=/);
        } else {
          // a visitor's post carries no session token: the CSRF check refuses it before the role check
          expect(res.status).toBe(403);
          expect(await changeCounts()).toEqual(before);
        }
      });
    }
  }
});

describe('audit log', () => {
  it('lists events by kind and exports them as JSON Lines, recording the export', async () => {
    const admin = sessions.admin;
    const page = await (await app.request('/admin/audit?kind=login', { headers: { cookie: admin.cookie } })).text();
    expect(page).toContain('<td>login</td>');
    expect(page).not.toContain('<td>import</td>');
    const res = await app.request('/admin/audit.jsonl?kind=import', { headers: { cookie: admin.cookie } });
    expect(res.headers.get('content-type')).toContain('application/x-ndjson');
    const lines = (await res.text()).trim().split('\n').map((l) => JSON.parse(l));
    expect(lines.length).toBeGreaterThan(0);
    expect(lines.every((l) => l.kind === 'import')).toBe(true);
    expect(lines[0]).toMatchObject({ kind: 'import', detail: { name: expect.any(String) } });
    const exported = await store.db.selectFrom('audit_events').select('kind').where('kind', '=', 'audit_export').execute();
    expect(exported.length).toBeGreaterThan(0);
  });
});
