import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { sqliteFactory } from '../helpers/stores.ts';
import { ORIGIN, demoPassword, signIn } from '../helpers/web.ts';
import { createApp } from '../../src/web/app.tsx';
import { migrate } from '../../src/store/migrate.ts';
import { seedDemo } from '../../src/demo/seed.ts';
import type { Store } from '../../src/store/connect.ts';

const factory = sqliteFactory();
let store: Store;
let app: ReturnType<typeof createApp>;
let admin: { cookie: string; csrf: string };

const batch = (prefix: string) =>
  [1, 2].map((i) => JSON.stringify({ prompt_id: `${prefix}${i}`, prompt: `Question ${i}?`, responses: [{ response_id: 'a', text: 'Yes.' }, { response_id: 'b', text: `No, ${prefix}.` }] })).join('\n');

async function createToken(name: string, scopes: string[]): Promise<string> {
  const body = new URLSearchParams({ _csrf: admin.csrf, name });
  for (const s of scopes) body.append('scopes', s);
  const res = await app.request('/admin/tokens', { method: 'POST', headers: { cookie: admin.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body });
  expect(res.status).toBe(201);
  return (await res.text()).match(/<code class="token">(plb_[\w-]+)<\/code>/)![1];
}

const post = (token: string | null, body: string, query = 'name=api%20batch', type = 'application/x-ndjson') =>
  app.request(`/api/v1/batches?${query}`, { method: 'POST', headers: { 'content-type': type, ...(token ? { authorization: `Bearer ${token}` } : {}) }, body });

beforeAll(async () => {
  store = await factory.open();
  await migrate(store);
  await seedDemo(store.db, { password: demoPassword });
  app = createApp({ store, maxBodyBytes: 64 * 1024, apiRateLimit: { requests: 5, perMs: 60_000 } });
  admin = await signIn(app, 'admin');
});
afterAll(async () => {
  await store.close();
  await factory.cleanup();
});

describe('API tokens', () => {
  it('are shown once and stored only as a hash', async () => {
    const token = await createToken('pipeline', ['import']);
    const rows = await store.db.selectFrom('api_tokens').selectAll().execute();
    expect(rows.some((r) => r.token_hash === createHash('sha256').update(token).digest('hex'))).toBe(true);
    expect(JSON.stringify(rows)).not.toContain(token);
    const list = await (await app.request('/admin/tokens', { headers: { cookie: admin.cookie } })).text();
    expect(list).toContain('pipeline');
    expect(list).not.toContain(token);
  });

  it('import a batch over HTTP, scored with the rubric', async () => {
    const token = await createToken('importer', ['import']);
    const res = await post(token, batch('h'), 'name=over%20http&reviews=2');
    expect(res.status).toBe(201);
    expect(await res.json()).toMatchObject({ items: 2, responses: 4, rubric: { id: 'general' } });
    const stored = await store.db.selectFrom('batches').selectAll().where('name', '=', 'over http').executeTakeFirstOrThrow();
    expect(stored.reviews_required).toBe(2);
  });

  it('answer a bad file with every problem and store nothing', async () => {
    const token = await createToken('bad files', ['import']);
    const before = await store.db.selectFrom('batches').select('id').execute();
    const res = await post(token, '{"prompt_id": "x"}\nnot json', 'name=bad');
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.problems.map((p: { line: number }) => p.line)).toEqual([1, 1, 2]);
    expect(await store.db.selectFrom('batches').select('id').execute()).toEqual(before);
  });

  const refusals: [string, () => Response | Promise<Response>, number, RegExp][] = [
    ['no token', () => post(null, batch('n')), 401, /Authorization: Bearer/],
    ['an unknown token', () => post('plb_made-up', batch('u')), 401, /unknown or revoked/],
    ['a token without the import scope', async () => post(await createToken('reader', ['export']), batch('e')), 403, /may not import/],
    ['a body that is neither JSON Lines nor CSV', async () => post(await createToken('typed', ['import']), 'x', 'name=t', 'text/plain'), 415, /application\/x-ndjson/],
    ['a body over the size limit', async () => post(await createToken('big', ['import']), 'x'.repeat(70 * 1024), 'name=big'), 413, /larger than this server accepts/],
  ];
  for (const [name, send, status, message] of refusals) {
    it(`refuse ${name} (${status})`, async () => {
      const res = await send();
      expect(res.status).toBe(status);
      expect(JSON.stringify(await res.json())).toMatch(message);
    });
  }

  it('stop working as soon as they are revoked', async () => {
    const token = await createToken('short-lived', ['import']);
    const row = await store.db.selectFrom('api_tokens').select('id').where('name', '=', 'short-lived').executeTakeFirstOrThrow();
    const revoke = await app.request(`/admin/tokens/${row.id}/revoke`, { method: 'POST', headers: { cookie: admin.cookie, origin: ORIGIN, 'x-csrf-token': admin.csrf } });
    expect(revoke.status).toBe(303);
    expect((await post(token, batch('r'), 'name=revoked')).status).toBe(401);
  });

  it('are rate-limited with a Retry-After', async () => {
    const token = await createToken('busy', ['import']);
    for (let i = 0; i < 5; i++) await post(token, 'not json', `name=rate${i}`);
    const res = await post(token, 'not json', 'name=rate-over');
    expect(res.status).toBe(429);
    expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
  });

  it('can only be created by an admin', async () => {
    const policy = await signIn(app, 'policy');
    const res = await app.request('/admin/tokens', { method: 'POST', headers: { cookie: policy.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: policy.csrf, name: 'x', scopes: 'import' }) });
    expect(res.status).toBe(403);
  });
});
